package org.rungtone.firmware;

import java.util.ArrayList;
import java.util.Comparator;
import java.util.List;
import org.rungtone.codec.TreadFormat;
import org.rungtone.internal.InputError;
import org.rungtone.internal.Setting;

/**
 * Checks the emitted tables against the user's flash budget ({@link Setting#FLASH_BUDGET}) and, when they do
 * not fit, names a setting that would.
 */
public final class FlashBudget {
    /** Sample rates tried when proposing a smaller setting, highest first. */
    private static final double[] RATES_HZ = {48000, 44100, 32000, 22050, 16000, 11025, 8000, 6000, 4000};
    /** Proposals drop at most this many bits. */
    private static final int MAX_BITS_DROPPED = 4;

    private FlashBudget() {
    }

    /**
     * A setting that could be proposed instead, and the bytes it would need.
     *
     * @param label how the message names it, e.g. {@code 6-bit packed at 8 kHz}
     * @param bytes flash bytes it needs
     */
    public record Candidate(String label, long bytes) {
    }

    /**
     * Checks that {@code neededBytes} fit the budget.
     *
     * @param candidates settings to propose, in order of preference: the message names the first that fits
     * @throws InputError when over budget, e.g. "the samples need 12,345 bytes, 2,345 bytes over the 10,000-byte
     *     flash budget (target.flash_budget); 6-bit packed at 8 kHz would fit (7,812 bytes)", the setting
     *     named as the user typed it
     */
    public static void check(long neededBytes, long budgetBytes, List<Candidate> candidates) {
        Refusal.check(Setting.FLASH_BUDGET, budgetBytes > 0, "the flash budget (%s) must be positive: %d",
                Setting.FLASH_BUDGET.ref(), budgetBytes);
        if (neededBytes <= budgetBytes) {
            return;
        }
        String head = "the samples need " + Fmt.bytes(neededBytes) + " bytes, " + Fmt.bytes(neededBytes - budgetBytes)
                + " bytes over the " + Fmt.bytes(budgetBytes) + "-byte flash budget (" + Setting.FLASH_BUDGET.ref()
                + ")";
        for (Candidate c : candidates) {
            if (c.bytes() <= budgetBytes) {
                throw Refusal.of(Setting.FLASH_BUDGET, "%s; %s would fit (%s bytes)", head, c.label(),
                        Fmt.bytes(c.bytes()));
            }
        }
        throw Refusal.of(Setting.FLASH_BUDGET, "%s; no smaller bit depth or rate fits either: shorten the sound or"
                + " raise the budget", head);
    }

    /**
     * Proposals for a sound of {@code samples} codes at {@code rateHz} and {@code bits} bits: packed storage
     * at the same or up to four fewer bits, at the same rate or a common lower one; for a Tread store, Tread
     * formats of as many or fewer bits per sample at the same or a lower rate instead; largest first (so the
     * first that fits keeps the most), ties broken by more bits. The current setting is left out.
     *
     * @param fixedBytes bytes that do not depend on the setting (sound tables, pin tables)
     */
    public static List<Candidate> alternatives(long samples, double rateHz, int bits, SampleStorage current,
            long fixedBytes) {
        List<double[]> grid = new ArrayList<>();
        List<Double> rates = new ArrayList<>();
        rates.add(rateHz);
        for (double r : RATES_HZ) {
            if (r < rateHz * (1 - 1e-9)) {
                rates.add(r);
            }
        }
        int stored = current.codec().map(TreadFormat::codeBits).orElse(0);
        for (double r : rates) {
            long n = (long) Math.ceil(samples * r / rateHz - 1e-9);
            for (int b = bits; b >= Math.max(1, bits - MAX_BITS_DROPPED); b--) {
                if (r == rateHz && b == bits && current == SampleStorage.PACKED || stored > 0) {
                    continue;
                }
                grid.add(new double[] {r, b, SampleStorage.PACKED.bytes(n, b) + fixedBytes, 0});
            }
            // a Tread store: the same ladder with fewer bits per sample, or the same store at a lower rate
            for (TreadFormat f : TreadFormat.values()) {
                if (f.codeBits() <= stored && (r != rateHz || f.codeBits() < stored)) {
                    grid.add(new double[] {r, bits, f.streamBytes(n) + fixedBytes, f.codeBits()});
                }
            }
        }
        grid.sort(Comparator.comparingDouble((double[] g) -> -g[2]).thenComparingDouble(g -> -g[1]));
        List<Candidate> out = new ArrayList<>(grid.size());
        for (double[] g : grid) {
            int b = (int) g[1];
            String label = g[3] > 0 ? "tread" + (int) g[3]
                    // 8- and 16-bit codes fill whole bytes: packing changes nothing, so do not call it packed
                    : b + "-bit" + (b % 8 == 0 ? "" : " packed");
            out.add(new Candidate(label + " at " + Fmt.hz(g[0]), (long) g[2]));
        }
        return out;
    }
}
