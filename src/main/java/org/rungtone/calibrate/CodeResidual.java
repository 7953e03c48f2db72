package org.rungtone.calibrate;

/**
 * How one measured code compares with the chosen model.
 *
 * @param code the DAC code
 * @param meanVolts the mean of its readings
 * @param readings how many readings
 * @param spreadVolts the standard deviation of its readings (0 for one)
 * @param modelVolts the chosen model's level
 * @param residualVolts reading minus model
 * @param score the studentised residual (see {@link BoardFit}); 0 when unchecked
 * @param status what the screen made of it
 */
public record CodeResidual(int code, double meanVolts, int readings, double spreadVolts, double modelVolts,
        double residualVolts, double score, Status status) {
    /** The verdict of the outlier screen on one code. */
    public enum Status {
        /** Fits the model. */
        OK,
        /** Left out of the fit: probably mistyped or measured at another code. */
        OUTLIER,
        /** Does not fit, but is the only reading that determines a parameter, so it was kept. */
        SUSPECT,
        /** The only reading that determines a parameter: the fit passes through it, nothing checks it. */
        UNCHECKED;

        /** The word shown in reports. */
        public String word() {
            return name().toLowerCase(java.util.Locale.ROOT);
        }
    }
}
