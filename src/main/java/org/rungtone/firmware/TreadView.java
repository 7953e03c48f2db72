package org.rungtone.firmware;

import java.util.ArrayList;
import java.util.List;
import java.util.Locale;
import java.util.function.ToIntFunction;
import java.util.stream.Collectors;
import org.rungtone.codec.TreadFormat;
import org.rungtone.codec.TreadState;

/**
 * Template values of a Tread store (docs/tread.md): the code layout, the decoder's tables and the reset
 * points.
 *
 * @param name the format, e.g. {@code tread3}
 * @param codeBits b, bits per stored code
 * @param codeMask 2^b − 1 in hex
 * @param magnitudeMask the magnitude bits, 2^(b−1) − 1 in hex
 * @param signBit the sign bit, 2^(b−1) in hex
 * @param magnitudes M, magnitudes per sign
 * @param maxIndex kmax, the largest step index at this ladder depth
 * @param compact true when the codes fit a byte: one table of (difference, next row) entries
 * @param tableEntries entries of that table, (kmax + 1) · M
 * @param table that table's body, two bytes an entry
 * @param compareTop the first code above the ladder, at most 255 (for an 8-bit compare)
 * @param steps STEP[0 .. kmax] as a C initialiser (wide codes)
 * @param adapt ADAPT[0 .. M − 1] as a C initialiser (wide codes)
 * @param resetType the C type of a reset point's codes
 * @param resetCount the reset points: the sounds' starts, then (loop engine) their loop starts
 * @param resetLast each reset point's last code y1, as a C initialiser
 * @param resetPrevious each reset point's code before it, y2
 * @param resetIndex each reset point's step index (compact: its row, k · M)
 * @param tableBytes flash bytes of the decoder's tables and the reset points
 */
record TreadView(String name, int codeBits, String codeMask, String magnitudeMask, String signBit, int magnitudes,
        int maxIndex, boolean compact, int tableEntries, String table, int compareTop, String steps, String adapt,
        String resetType, int resetCount, String resetLast, String resetPrevious, String resetIndex,
        long tableBytes) {
    private static final int ENTRIES_PER_LINE = 8;

    /** The values of a Tread plan at {@code bits}-bit ladder codes. */
    static TreadView of(TreadPlan t, int bits) {
        TreadFormat f = t.format();
        int kmax = f.maxIndex(bits);
        int m = f.magnitudes();
        List<String> steps = new ArrayList<>();
        for (int k = 0; k <= kmax; k++) {
            steps.add(TreadFormat.step(k) + "u");
        }
        List<String> adapt = new ArrayList<>();
        for (int i = 0; i < m; i++) {
            adapt.add(Integer.toString(f.adaptation(i)));
        }
        List<TreadState> r = t.resets();
        int rowScale = t.compact() ? m : 1;
        return new TreadView(f.optionName(), f.codeBits(), hex((1 << f.codeBits()) - 1), hex(m - 1), hex(m), m,
                kmax, t.compact(), (kmax + 1) * m, t.compact() ? table(f, kmax) : "", Math.min(255, 1 << bits),
                String.join(", ", steps), String.join(", ", adapt), t.compact() ? "uint8_t" : "uint16_t", r.size(),
                join(r, TreadState::last), join(r, TreadState::previous),
                join(r, s -> s.index() * rowScale), t.tableBytes());
    }

    /** The compact table: per step index k and magnitude m, the difference and the row of the next index. */
    private static String table(TreadFormat f, int kmax) {
        int m = f.magnitudes();
        StringBuilder b = new StringBuilder();
        for (int k = 0; k <= kmax; k++) {
            for (int i = 0; i < m; i++) {
                int next = Math.min(kmax, Math.max(0, k + f.adaptation(i)));
                int entry = k * m + i;
                b.append(entry % ENTRIES_PER_LINE == 0 ? "    " : " ").append(TreadFormat.difference(k, i))
                        .append("u, ").append(next * m).append('u');
                boolean last = k == kmax && i == m - 1;
                b.append(last ? "" : ",").append(last || entry % ENTRIES_PER_LINE == ENTRIES_PER_LINE - 1 ? "\n" : "");
            }
        }
        return b.toString();
    }

    private static String hex(int value) {
        return "0x" + Integer.toHexString(value).toUpperCase(Locale.ROOT);
    }

    private static String join(List<TreadState> states, ToIntFunction<TreadState> field) {
        return states.stream().map(s -> field.applyAsInt(s) + "u").collect(Collectors.joining(", "));
    }
}
