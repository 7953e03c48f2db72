package org.rungtone.calibrate;

import java.util.List;
import org.rungtone.ladder.LevelTable;

/**
 * Everything a fit found: the readings' resolution and spread, how each model fared, which was chosen and
 * why, every code's residual and verdict, and the full level table for the unit profile.
 *
 * @param source where the readings came from
 * @param bits bit depth N
 * @param readingCount number of readings
 * @param unmeasuredCodes codes listed without a reading
 * @param resolutionVolts meter resolution used (given, or taken from the readings' digits; 0 if unknown)
 * @param repeatSpreadVolts pooled standard deviation of repeated readings (0 without repeats)
 * @param floorVolts the residual scale below which nothing is resolved:
 *     {@code sqrt(q²/12 + s_repeat²)} (uniform rounding to step q has variance q²/12; Bennett, BSTJ 27, 1948)
 * @param superposition how the superposition model fared
 * @param switchedLoad how the switched-load model fared
 * @param chosen the chosen model
 * @param reason one sentence on why that model was chosen
 * @param parameterSigmas standard deviation of each of the chosen model's parameters, in its order
 * @param residuals every measured code, ascending
 * @param outlierCodes codes left out of the chosen fit
 * @param levels the board's level table: the measured one when every code was read, else the model's
 * @param tableMeasured true when {@code levels} holds the readings themselves
 * @param levelSigmas the standard deviation of each level of {@code levels}, index = code
 * @param warnings what deserves attention
 */
public record FitReport(String source, int bits, int readingCount, List<Integer> unmeasuredCodes,
        double resolutionVolts, double repeatSpreadVolts, double floorVolts, ModelSummary superposition,
        ModelSummary switchedLoad, BoardModel chosen, String reason, List<Double> parameterSigmas,
        List<CodeResidual> residuals, List<Integer> outlierCodes, LevelTable levels, boolean tableMeasured,
        List<Double> levelSigmas, List<String> warnings) {
    /** Copies the lists. */
    public FitReport {
        unmeasuredCodes = List.copyOf(unmeasuredCodes);
        parameterSigmas = List.copyOf(parameterSigmas);
        residuals = List.copyOf(residuals);
        outlierCodes = List.copyOf(outlierCodes);
        levelSigmas = List.copyOf(levelSigmas);
        warnings = List.copyOf(warnings);
    }

    /** The code whose level is least certain. */
    public int leastCertainCode() {
        int worst = 0;
        for (int k = 1; k < levelSigmas.size(); k++) {
            worst = levelSigmas.get(k) > levelSigmas.get(worst) ? k : worst;
        }
        return worst;
    }

    /** Number of measured codes. */
    public int codesMeasured() {
        return residuals.size();
    }

    /** The summary of the chosen model. */
    public ModelSummary chosenSummary() {
        return chosen.key().equals(superposition.key()) ? superposition : switchedLoad;
    }
}
