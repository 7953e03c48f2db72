package org.rungtone.script.eval;

import java.util.OptionalDouble;

/**
 * What a script declares: a clip of {@code durationSeconds} or a wavetable of {@code tableLength} samples,
 * and optionally its preferred sample rate.
 */
public record Header(boolean wavetable, double durationSeconds, int tableLength, OptionalDouble rateHz) {
}
