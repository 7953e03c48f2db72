package org.rungtone.ladder;

/**
 * What K simulated boards of one ladder did: per board the worst |DNL|, worst |INL| (endpoint and
 * best-fit, LSB), whether it is monotonic, and the SINAD of a full-scale sine played through it; with
 * summaries. Board i always has the same values for the same seed, whatever the number of threads.
 */
public final class MonteCarloResult {
    private final int bits;
    private final long seed;
    private final Spread spread;
    private final double tolerance;
    private final double[] worstDnl;
    private final double[] worstInl;
    private final double[] worstInlBestFit;
    private final double[] sinadDb;
    private final boolean[] monotonic;
    private final double nominalSinadDb;

    /**
     * Each board's figures, one array element a board (handed over without a copy).
     *
     * @param worstDnl largest |DNL| in LSB
     * @param worstInl largest |INL| (endpoint) in LSB
     * @param worstInlBestFit largest |INL| (best fit) in LSB
     * @param sinadDb SINAD of the probe sine
     * @param monotonic whether the board is monotonic
     */
    record PerBoard(double[] worstDnl, double[] worstInl, double[] worstInlBestFit, double[] sinadDb,
            boolean[] monotonic) {
    }

    MonteCarloResult(int bits, long seed, Spread spread, double tolerance, PerBoard boards, double nominalSinadDb) {
        this.bits = bits;
        this.seed = seed;
        this.spread = spread;
        this.tolerance = tolerance;
        this.worstDnl = boards.worstDnl();
        this.worstInl = boards.worstInl();
        this.worstInlBestFit = boards.worstInlBestFit();
        this.sinadDb = boards.sinadDb();
        this.monotonic = boards.monotonic();
        this.nominalSinadDb = nominalSinadDb;
    }

    /** Number of boards. */
    public int boards() {
        return monotonic.length;
    }

    /** Bit depth. */
    public int bits() {
        return bits;
    }

    /** The seed used. */
    public long seed() {
        return seed;
    }

    /** How values were drawn. */
    public Spread spread() {
        return spread;
    }

    /** The tolerance of the parts (used by a uniform spread). */
    public double tolerance() {
        return tolerance;
    }

    /** Worst |DNL| of every board, LSB, a copy. */
    public double[] worstDnlLsb() {
        return worstDnl.clone();
    }

    /** Worst |endpoint INL| of every board, LSB, a copy. */
    public double[] worstInlLsb() {
        return worstInl.clone();
    }

    /** Worst |best-fit INL| of every board, LSB, a copy. */
    public double[] worstInlBestFitLsb() {
        return worstInlBestFit.clone();
    }

    /** SINAD of every board, dB, a copy. */
    public double[] sinadDb() {
        return sinadDb.clone();
    }

    /** Whether each board is monotonic, a copy. */
    public boolean[] monotonic() {
        return monotonic.clone();
    }

    /** SINAD of the nominal board through the same sine, dB. */
    public double nominalSinadDb() {
        return nominalSinadDb;
    }

    /** Summary of worst |DNL|. */
    public Stats worstDnlStats() {
        return Stats.of(worstDnl);
    }

    /** Summary of worst |endpoint INL|. */
    public Stats worstInlStats() {
        return Stats.of(worstInl);
    }

    /** Summary of worst |best-fit INL|. */
    public Stats worstInlBestFitStats() {
        return Stats.of(worstInlBestFit);
    }

    /** Summary of SINAD, dB. */
    public Stats sinadStats() {
        return Stats.of(sinadDb);
    }

    /** Summary of ENOB = (SINAD − 1.76)/6.02 (IEEE Std 1241), bits. */
    public Stats enobStats() {
        double[] e = new double[sinadDb.length];
        for (int i = 0; i < e.length; i++) {
            e[i] = SineProbe.enob(sinadDb[i]);
        }
        return Stats.of(e);
    }

    /** Number of monotonic boards. */
    public int monotonicBoards() {
        int n = 0;
        for (boolean m : monotonic) {
            n += m ? 1 : 0;
        }
        return n;
    }

    /** Share of monotonic boards, 0..1. */
    public double monotonicFraction() {
        return (double) monotonicBoards() / monotonic.length;
    }

    /**
     * The 95 % Wilson score interval {low, high} of the probability that a board is monotonic (E. B. Wilson,
     * "Probable inference...", JASA 22, 1927): centre {@code (p + z²/2n)/(1 + z²/n)}, half-width
     * {@code z·√(p(1−p)/n + z²/4n²)/(1 + z²/n)} with z = 1.96.
     */
    public double[] monotonicInterval95() {
        double n = monotonic.length;
        double p = monotonicFraction();
        double z = 1.959964;
        double d = 1 + z * z / n;
        double centre = (p + z * z / (2 * n)) / d;
        double half = z * Math.sqrt(p * (1 - p) / n + z * z / (4 * n * n)) / d;
        return new double[] {Math.max(0, centre - half), Math.min(1, centre + half)};
    }
}
