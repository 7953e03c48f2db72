package org.rungtone.calibrate;

import org.rungtone.internal.InputError;
import org.rungtone.internal.Setting;
import org.rungtone.internal.Units;

/**
 * The DC-volts ranges of a digital multimeter of a given count, and the step it reads a level with. A meter
 * of C counts shows at most C − 1 steps on each range; its ranges are C steps of a power of ten, the lowest
 * one between 0.2 V and 2 V (2000 counts: 200 mV, 2 V, 20 V, 200 V with steps of 0.1 mV, 1 mV, 10 mV,
 * 100 mV; 6000 counts: 600 mV, 6 V, 60 V; common practice, no source). An autoranging meter reads each level
 * on the lowest range that holds it; a manual one is left on the range that holds the highest level of the
 * plan.
 *
 * @param counts the meter's count: 2000 for a 3½-digit meter, 20000 for a 4½-digit one
 * @param autoranging true when the meter picks the range for each reading
 */
public record MeterRanges(int counts, boolean autoranging) {
    /** The fewest counts accepted (a 2½-digit meter). */
    public static final int MIN_COUNTS = 200;
    /** The most counts accepted (a 6½-digit bench meter shows 1,999,999 or so). */
    public static final int MAX_COUNTS = 2_000_000;

    /**
     * Checks the count.
     *
     * @throws org.rungtone.internal.SettingError when the count is outside {@value #MIN_COUNTS} ..
     *     {@value #MAX_COUNTS}
     */
    public MeterRanges {
        Setting.METER_COUNTS.check(counts >= MIN_COUNTS && counts <= MAX_COUNTS, "must be a meter's count, %d"
                + " .. %d (2000 for a 3½-digit meter, 20000 for a 4½-digit one): %d", MIN_COUNTS, MAX_COUNTS,
                counts);
    }

    /**
     * A meter from its count as written: {@code 2000}, {@code 20000} or {@code 6k}.
     *
     * @throws org.rungtone.internal.SettingError when the text is not a whole count in range
     */
    public static MeterRanges parse(String text, boolean autoranging) {
        long counts;
        try {
            counts = Units.parseCount(text);
        } catch (InputError e) {
            throw Setting.METER_COUNTS.error("must be the meter's count, a whole number such as 2000 (3½ digits)"
                    + " or 20000 (4½ digits): %s", text);
        }
        return new MeterRanges((int) Math.max(Integer.MIN_VALUE, Math.min(Integer.MAX_VALUE, counts)),
                autoranging);
    }

    /** The step of the lowest range: the power of ten that puts C steps between 0.2 V and 2 V. */
    public double lowestStepVolts() {
        double step = 1e-9;
        while (counts * step < 0.2 - 1e-12) {
            step *= 10;
        }
        return step;
    }

    /** The step of the lowest range that holds {@code volts}: it shows at most C − 1 steps. */
    public double autorangedStepVolts(double volts) {
        double step = lowestStepVolts();
        while (Math.abs(volts) >= (counts - 0.5) * step && step < 1e3) {
            step *= 10;
        }
        return step;
    }

    /**
     * The step this meter reads {@code volts} with when the highest level of the plan is {@code maxAbsVolts}:
     * its own range when autoranging, else the one range that holds the highest level.
     */
    public double stepVolts(double volts, double maxAbsVolts) {
        return autoranging ? autorangedStepVolts(volts) : autorangedStepVolts(maxAbsVolts);
    }

    /** The highest level the range of {@code stepVolts} shows, volts. */
    public double rangeTopVolts(double stepVolts) {
        return (counts - 1) * stepVolts;
    }
}
