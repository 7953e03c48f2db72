package org.rungtone.analysis;

import java.util.List;
import java.util.Optional;

/**
 * The result of a survey: every cell, ordered by rate (as given) and then bit depth (as given).
 *
 * @param rows the cells
 * @param target the target quality, or null when none was given
 * @param flashBudgetBytes the flash budget, or null when none was given
 * @param packed whether the budget and the choice count bit-packed bytes
 */
public record SurveyResult(List<SurveyRow> rows, SurveyTarget target, Long flashBudgetBytes, boolean packed) {
    /** Copies the rows. */
    public SurveyResult {
        rows = List.copyOf(rows);
    }

    /** The chosen row: the fewest flash bytes that fit and reach the target. */
    public Optional<SurveyRow> chosen() {
        return rows.stream().filter(SurveyRow::chosen).findFirst();
    }

    /** The rows at one rate, in bit-depth order. */
    public List<SurveyRow> rowsAtRate(double rateHz) {
        return rows.stream().filter(r -> r.rateHz() == rateHz).toList();
    }
}
