package org.rungtone.calibrate;

import java.util.List;
import java.util.Optional;

/**
 * How one model family fared on the readings.
 *
 * @param key the model's name
 * @param model the fitted model, empty when the readings do not determine it
 * @param keptReadings codes that entered the final fit
 * @param rmsVolts residual root mean square over kept codes, corrected for the parameters:
 *     {@code sqrt(RSS/(m − p))}; NaN without spare readings
 * @param maxAbsVolts the largest kept residual magnitude
 * @param outlierCodes codes left out of the fit
 * @param note why it could not be fitted, or empty
 */
public record ModelSummary(String key, Optional<BoardModel> model, int keptReadings, double rmsVolts,
        double maxAbsVolts, List<Integer> outlierCodes, String note) {
    /** Copies the list. */
    public ModelSummary {
        outlierCodes = List.copyOf(outlierCodes);
    }

    /** True when the model was fitted. */
    public boolean fitted() {
        return model.isPresent();
    }
}
