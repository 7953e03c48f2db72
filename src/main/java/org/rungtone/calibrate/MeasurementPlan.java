package org.rungtone.calibrate;

import java.io.IOException;
import java.util.ArrayList;
import java.util.BitSet;
import java.util.Collections;
import java.util.List;
import java.util.Locale;
import java.util.Optional;
import org.apache.commons.csv.CSVFormat;
import org.apache.commons.csv.CSVPrinter;
import org.rungtone.internal.Checks;
import org.rungtone.ladder.LevelTable;

/**
 * The codes to measure on a built board, in checklist (and sweep) order, with the level the ladder model
 * expects for each.
 *
 * <p>The basis is code 0 (the offset), the all-ones code and each single-bit code (each bit's weight): the
 * fewest readings that determine the superposition model {@code V(k) = V0 + Σ b_i·w_i}. Verification codes
 * on top give the fit redundancy, so a mistyped reading stands out, and let the switched-load model be
 * fitted; they are spread over the range by the additive golden-ratio (Kronecker) sequence
 * {@code u_j = frac(1/2 + j·(φ − 1))}, which gives well-spread codes with varied bit patterns (a regular grid
 * of a power-of-two count would leave the low bits always zero). Up to {@value #EVERY_CODE_MAX_BITS} bits the
 * default is every code: then the measured table itself is the profile.
 */
public final class MeasurementPlan {
    /** Up to this many bits the default plan measures every code. */
    public static final int EVERY_CODE_MAX_BITS = 6;
    private static final double GOLDEN_STEP = (Math.sqrt(5) - 1) / 2;

    private final LevelTable expected;
    private final List<PlannedCode> codes;
    private final boolean everyCode;

    private MeasurementPlan(LevelTable expected, List<PlannedCode> codes, boolean everyCode) {
        this.expected = expected;
        this.codes = Collections.unmodifiableList(codes);
        this.everyCode = everyCode;
    }

    /** The default count of verification codes: none when every code is measured, else 2·N, at least 8. */
    public static int defaultVerifyCount(int bits) {
        return bits <= EVERY_CODE_MAX_BITS ? 0 : Math.max(8, 2 * bits);
    }

    /** The default plan: every code up to {@value #EVERY_CODE_MAX_BITS} bits, else basis plus 2·N checks. */
    public static MeasurementPlan of(LevelTable expected) {
        int bits = expected.bits();
        return bits <= EVERY_CODE_MAX_BITS ? everyCode(expected) : of(expected, defaultVerifyCount(bits));
    }

    /**
     * The basis codes plus {@code verifyCount} verification codes; when they would cover every code, the plan
     * measures every code in order.
     *
     * @throws org.rungtone.internal.InputError when verifyCount is negative
     */
    public static MeasurementPlan of(LevelTable expected, int verifyCount) {
        return of(expected, verifyCount, Optional.empty());
    }

    /**
     * The basis codes plus {@code verifyCount} verification codes chosen for {@code meter} when given
     * ({@link MeterDesign}: most on the meter's finer ranges), else spread over the range; when they would
     * cover every code, the plan measures every code in order.
     *
     * @throws org.rungtone.internal.InputError when verifyCount is negative
     */
    public static MeasurementPlan of(LevelTable expected, int verifyCount, Optional<MeterRanges> meter) {
        Checks.checkInput(verifyCount >= 0, "--verify must be 0 or more: %d", verifyCount);
        int bits = expected.bits();
        int n = 1 << bits;
        List<PlannedCode> list = new ArrayList<>();
        BitSet used = new BitSet(n);
        add(list, used, expected, 0, PlannedCode.Role.ZERO);
        add(list, used, expected, n - 1, PlannedCode.Role.FULL);
        for (int b = 0; b < bits; b++) {
            add(list, used, expected, 1 << b, PlannedCode.Role.BIT);
        }
        int free = n - used.cardinality();
        if (verifyCount >= free) {
            return everyCode(expected);
        }
        List<Integer> checks = new ArrayList<>();
        if (meter.isPresent()) {
            checks.addAll(MeterDesign.checks(expected, used, verifyCount, meter.get()));
        }
        for (int j = 0; meter.isEmpty() && j < verifyCount; j++) {
            double u = (0.5 + j * GOLDEN_STEP) % 1.0;
            int c = nearestFree(used, 1 + (int) Math.floor(u * (n - 2)), n);
            used.set(c);
            checks.add(c);
        }
        Collections.sort(checks);
        for (int c : checks) {
            list.add(new PlannedCode(c, PlannedCode.Role.VERIFY, expected.volts(c)));
        }
        return new MeasurementPlan(expected, list, false);
    }

    /** Every code, in ascending order. */
    public static MeasurementPlan everyCode(LevelTable expected) {
        List<PlannedCode> list = new ArrayList<>();
        int top = expected.size() - 1;
        for (int k = 0; k <= top; k++) {
            PlannedCode.Role role = k == 0 ? PlannedCode.Role.ZERO : k == top ? PlannedCode.Role.FULL
                    : Integer.bitCount(k) == 1 ? PlannedCode.Role.BIT : PlannedCode.Role.EVERY;
            list.add(new PlannedCode(k, role, expected.volts(k)));
        }
        return new MeasurementPlan(expected, list, true);
    }

    private static void add(List<PlannedCode> list, BitSet used, LevelTable expected, int code,
            PlannedCode.Role role) {
        if (!used.get(code)) {
            used.set(code);
            list.add(new PlannedCode(code, role, expected.volts(code)));
        }
    }

    /** The free code nearest to {@code start} (upwards first); the caller guarantees one exists. */
    private static int nearestFree(BitSet used, int start, int n) {
        for (int d = 0; d < n; d++) {
            if (start + d < n && !used.get(start + d)) {
                return start + d;
            }
            if (start - d >= 0 && !used.get(start - d)) {
                return start - d;
            }
        }
        throw new IllegalStateException("no free code left");
    }

    /** Bit depth N. */
    public int bits() {
        return expected.bits();
    }

    /** The planned codes in checklist order. */
    public List<PlannedCode> codes() {
        return codes;
    }

    /** The codes alone, in checklist order (the sweep order). */
    public int[] codeArray() {
        int[] out = new int[codes.size()];
        for (int i = 0; i < out.length; i++) {
            out[i] = codes.get(i).code();
        }
        return out;
    }

    /** The modelled levels the expectations come from. */
    public LevelTable expected() {
        return expected;
    }

    /** True when the plan measures every code. */
    public boolean everyCode() {
        return everyCode;
    }

    /** The highest expected level, volts. */
    public double maxExpectedVolts() {
        double m = Double.NEGATIVE_INFINITY;
        for (PlannedCode c : codes) {
            m = Math.max(m, c.expectedVolts());
        }
        return m;
    }

    /** The code as N binary digits, MSB first. */
    public static String binary(int code, int bits) {
        StringBuilder b = new StringBuilder(bits);
        for (int i = bits - 1; i >= 0; i--) {
            b.append((code >> i) & 1);
        }
        return b.toString();
    }

    /** The CSV template: code, binary, expected_volts, and an empty measured column, one row per code. */
    public String csv() {
        return csv(List.of());
    }

    /**
     * The CSV with readings filled in: for each planned code, one row per reading in {@code readings} (the
     * list index is the position in {@link #codes()}; an empty or missing list leaves the cell empty).
     *
     * @param readings per planned code, the readings as they should appear in the measured column
     */
    public String csv(List<List<String>> readings) {
        StringBuilder sb = new StringBuilder();
        CSVFormat format = CSVFormat.DEFAULT.builder().setRecordSeparator("\n").setCommentMarker('#')
                .setHeaderComments("Rungtone measurement plan, " + bits() + "-bit ladder, " + codes.size()
                        + " codes. Put each code on the pins, read the output",
                        "with a DC voltmeter and write the reading in the measured column: 2.613, 2.613 V or",
                        "612mV ('.' is the decimal point). Add a row with the same code for each extra reading.")
                .setHeader("code", "binary", "expected_volts", "measured").build();
        try (CSVPrinter p = new CSVPrinter(sb, format)) {
            for (int i = 0; i < codes.size(); i++) {
                PlannedCode c = codes.get(i);
                List<String> r = i < readings.size() ? readings.get(i) : List.of();
                String expectedText = String.format(Locale.ROOT, "%.4f", c.expectedVolts());
                if (r.isEmpty()) {
                    p.printRecord(c.code(), binary(c.code(), bits()), expectedText, "");
                }
                for (String value : r) {
                    p.printRecord(c.code(), binary(c.code(), bits()), expectedText, value);
                }
            }
        } catch (IOException e) {
            throw new IllegalStateException("CSV to memory failed", e);
        }
        return sb.toString();
    }
}
