package org.rungtone.firmware;

import java.util.ArrayList;
import java.util.List;
import java.util.Locale;
import org.rungtone.quantize.Codes;

/**
 * The context of the sample-array templates ({@code generic/samples.h} and {@code generic/samples.c}): one
 * sound's codes as a bare C array.
 *
 * @param symbol the C symbol prefix
 * @param macro the macro prefix, the symbol in upper case
 * @param toolVersion the Rungtone version
 * @param settings one "key: value" line per setting of the build
 * @param code the DAC code
 * @param array the array
 */
record SampleArrayView(String symbol, String macro, String toolVersion, List<String> settings, CodeView code,
        ArrayView array) {
    private static final int PER_LINE = 16;

    /**
     * The array.
     *
     * @param length how many samples
     * @param rateHz the playback rate in whole hertz
     * @param flash the attribute after the declaration that keeps it in flash, with a leading space, or empty
     * @param bytes its size in bytes
     * @param data the C array body, written straight to the file
     * @param durationMs its duration in milliseconds, one decimal
     */
    record ArrayView(int length, long rateHz, String flash, long bytes, Templates.Stream data, String durationMs) {
    }

    /** The context of a request. */
    static SampleArrayView of(SampleArrayEmitter.Request r) {
        Codes codes = r.codes();
        int bits = codes.bits();
        List<String> settings = new ArrayList<>();
        for (String s : r.settings()) {
            settings.add(s.replace("*/", "* /"));
        }
        Templates.Stream data = Templates.stream(out -> CLiterals.writeArrayBody(codes.unsafeCodes(),
                CLiterals.hexDigits(bits), PER_LINE, "    ", out));
        String flash = r.flashQualifier().isEmpty() ? "" : " " + r.flashQualifier();
        ArrayView array = new ArrayView(codes.length(), Math.round(codes.sampleRateHz()), flash,
                (long) codes.length() * (bits <= 8 ? 1 : 2), data, String.format(Locale.ROOT, "%.1f",
                        1000.0 * codes.length() / codes.sampleRateHz()));
        return new SampleArrayView(r.symbol(), CNames.macro(r.symbol()), r.toolVersion(), List.copyOf(settings),
                CodeView.of(bits), array);
    }
}
