package org.rungtone.project;

import java.util.regex.Matcher;
import java.util.regex.Pattern;
import org.rungtone.internal.InputError;
import org.rungtone.internal.Setting;
import org.rungtone.internal.Units;

/**
 * Loop points of a looped sound, written {@code START:END} in samples ({@code 1200:9600}) or as times
 * ({@code 0.25s:1.2s}, {@code 250ms:end}); {@code end} means the last sample. {@code auto} asks for a loop
 * found in the sound ({@link AutoLoop}); its points are known once the sound is conditioned.
 *
 * @param start start, in samples or seconds (0 for auto)
 * @param end end (exclusive), in samples or seconds; infinite for "end" and for auto
 * @param seconds whether the values are seconds
 * @param auto whether the loop is to be found in the sound
 */
public record LoopSpan(double start, double end, boolean seconds, boolean auto) {
    /** A loop to be found in the sound. */
    public static final LoopSpan AUTO = new LoopSpan(0, Double.POSITIVE_INFINITY, false, true);
    private static final Pattern FORM = Pattern.compile("\\s*([^:]+?)\\s*:\\s*([^:]+?)\\s*");

    /**
     * Parses the text.
     *
     * @throws InputError with an example when the text is malformed
     */
    public static LoopSpan parse(String text) {
        if (text != null && text.trim().equals("auto")) {
            return AUTO;
        }
        Matcher m = FORM.matcher(text == null ? "" : text);
        if (!m.matches()) {
            throw Setting.LOOP.error("'%s' must be START:END in samples (1200:9600) or times (0.25s:end), or auto",
                    text);
        }
        boolean secs = m.group(1).endsWith("s") || m.group(2).endsWith("s");
        double start = value(m.group(1), secs, text);
        double end = m.group(2).equals("end") ? Double.POSITIVE_INFINITY : value(m.group(2), secs, text);
        if (!(start >= 0) || !(end > start)) {
            throw Setting.LOOP.error("'%s' needs 0 <= START < END", text);
        }
        return new LoopSpan(start, end, secs, false);
    }

    private static double value(String s, boolean secs, String text) {
        try {
            return secs ? Units.parse(s, "s") : Units.parseCount(s);
        } catch (InputError e) {
            throw Setting.LOOP.error("'%s': %s", text, e.getMessage());
        }
    }

    /**
     * Start and end in samples at {@code rateHz} of a sound of {@code length} samples; "end" is its length.
     *
     * @throws org.rungtone.internal.SettingError when the start is not inside the sound, the end is past it,
     *     or the two meet once rounded to samples
     * @throws IllegalStateException for auto, whose points the sound decides
     */
    public int[] samples(double rateHz, int length) {
        if (auto) {
            throw new IllegalStateException("an automatic loop has no points of its own");
        }
        long s = seconds ? Math.round(start * rateHz) : (long) start;
        long e = Double.isInfinite(end) ? length : seconds ? Math.round(end * rateHz) : (long) end;
        if (s >= length) {
            throw Setting.LOOP.error("start %s is at or past the sound's end (%s, %d samples); the loop must"
                    + " start inside the sound", seconds ? Units.format(start, "s") : Long.toString(s),
                    Units.format(length / rateHz, "s"), length);
        }
        if (e > length) {
            throw Setting.LOOP.error("end %s is past the sound's end (%d samples)",
                    seconds ? Units.format(end, "s") : Long.toString(e), length);
        }
        if (s >= e) {
            throw Setting.LOOP.error("start must come before its end");
        }
        return new int[] {(int) s, (int) e};
    }
}
