package org.rungtone.report;

import java.util.Optional;
import java.util.OptionalDouble;
import org.rungtone.condition.Conditioner;
import org.rungtone.condition.Conditioning;

/**
 * How a sound was conditioned, as values for machine-readable reports: the settings, and for one build what
 * they did.
 *
 * @param dcRemoved the mean was subtracted
 * @param trimBelowDbfs the trim threshold, when trimming
 * @param gainDb the fixed gain asked for
 * @param normalizeDbfs the peak level asked for
 * @param fadeInSeconds the fade-in
 * @param fadeOutSeconds the fade-out
 * @param applied what conditioning did to one build's source (none for a survey, which conditions per rate)
 */
public record ConditioningFacts(boolean dcRemoved, OptionalDouble trimBelowDbfs, OptionalDouble gainDb,
        OptionalDouble normalizeDbfs, double fadeInSeconds, double fadeOutSeconds, Optional<Applied> applied) {

    /**
     * What conditioning did.
     *
     * @param gainDb the gain applied (fixed, or found by normalizing)
     * @param trimmedStartSeconds silence trimmed at the start
     * @param trimmedEndSeconds silence trimmed at the end
     */
    public record Applied(double gainDb, double trimmedStartSeconds, double trimmedEndSeconds) {
    }

    /** The settings alone. */
    public static ConditioningFacts of(Conditioning c) {
        return new ConditioningFacts(c.removeDc(), c.trimBelowDbfs(), c.gainDb(), c.normalizeDbfs(),
                c.fadeInSeconds(), c.fadeOutSeconds(), Optional.empty());
    }

    /** The settings and what they did. */
    public static ConditioningFacts of(Conditioning c, Conditioner.Conditioned done) {
        return new ConditioningFacts(c.removeDc(), c.trimBelowDbfs(), c.gainDb(), c.normalizeDbfs(),
                c.fadeInSeconds(), c.fadeOutSeconds(), Optional.of(new Applied(done.gainDb(),
                        done.trimmedStartSeconds(), done.trimmedEndSeconds())));
    }
}
