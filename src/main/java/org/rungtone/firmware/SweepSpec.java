package org.rungtone.firmware;

import java.util.Arrays;
import java.util.Optional;
import org.rungtone.internal.Checks;
import org.rungtone.internal.Setting;

/**
 * The measurement sweep: put each code on the ladder in turn, holding it for {@code holdMillis} or until
 * the next press of a button (active low, internal pull-up, debounced for {@value #DEBOUNCE_MILLIS} ms).
 * The sweep ticks at {@value #TICK_HZ} Hz. A sweep for a recording is framed by a pattern of
 * {@link #patternSteps()} steps at each end, each held {@link #patternTicks()} ticks instead.
 */
public final class SweepSpec {
    /** Tick rate of the sweep program. */
    public static final double TICK_HZ = 1000;
    /** A button level must stay this long before a press counts. */
    public static final int DEBOUNCE_MILLIS = 20;

    private final int bits;
    private final int[] codes;
    private final double holdMillis;
    private final Optional<String> buttonPin;
    private final int patternSteps;
    private final int patternTicks;

    private SweepSpec(int bits, int[] codes, double holdMillis, Optional<String> buttonPin) {
        this(bits, codes, holdMillis, buttonPin, 0, 0);
    }

    private SweepSpec(int bits, int[] codes, double holdMillis, Optional<String> buttonPin, int patternSteps,
            int patternTicks) {
        Checks.checkBits(bits);
        Checks.checkInput(codes.length >= 1 && codes.length <= 65535, "a sweep needs 1..65535 codes: %d",
                codes.length);
        int max = (1 << bits) - 1;
        for (int i = 0; i < codes.length; i++) {
            Checks.checkInput(codes[i] >= 0 && codes[i] <= max, "sweep code %d at position %d is outside"
                    + " 0..%d for %d bits", codes[i], i + 1, max, bits);
        }
        this.bits = bits;
        this.codes = codes.clone();
        this.holdMillis = holdMillis;
        this.buttonPin = buttonPin;
        this.patternSteps = patternSteps;
        this.patternTicks = patternTicks;
    }

    /**
     * A sweep for a recording: {@code patternSteps} steps of {@code patternTicks} ticks, then the codes between
     * held {@code holdMillis} each, then {@code patternSteps} steps of {@code patternTicks} ticks again;
     * {@code codes} holds all of them in order.
     *
     * @throws org.rungtone.internal.InputError when a code does not fit, the hold is not positive, or the
     *     patterns leave no code between them
     */
    public static SweepSpec recording(int bits, int[] codes, double holdMillis, int patternSteps,
            int patternTicks) {
        Setting.HOLD.check(Double.isFinite(holdMillis) && holdMillis > 0, "must be a positive time: %s ms",
                holdMillis);
        Checks.checkArgument(patternSteps >= 1 && patternTicks >= 1 && codes.length > 2 * patternSteps,
                "a recording sweep needs codes between its two patterns of %d steps: %d codes", patternSteps,
                codes.length);
        return new SweepSpec(bits, codes, holdMillis, Optional.empty(), patternSteps, patternTicks);
    }

    /**
     * A sweep that holds each code for {@code holdMillis} milliseconds (rounded to whole ticks, at least one).
     *
     * @throws org.rungtone.internal.InputError when a code does not fit, or the hold is not positive
     */
    public static SweepSpec holding(int bits, int[] codes, double holdMillis) {
        Setting.HOLD.check(Double.isFinite(holdMillis) && holdMillis > 0, "must be a positive time: %s ms",
                holdMillis);
        return new SweepSpec(bits, codes, holdMillis, Optional.empty());
    }

    /**
     * A sweep that moves to the next code at each press of the button on {@code buttonPin} (pin notation of
     * {@link PinMap}, e.g. {@code PD2}).
     *
     * @throws org.rungtone.internal.InputError when a code does not fit
     */
    public static SweepSpec onButton(int bits, int[] codes, String buttonPin) {
        Setting.BUTTON.check(buttonPin != null && !buttonPin.isBlank(), "needs a pin, e.g. PD2");
        return new SweepSpec(bits, codes, 0, Optional.of(buttonPin.trim()));
    }

    /**
     * A sweep from the calibration plan: held for {@code holdMillis} per code, or, when {@code buttonPin} is
     * present, advanced on each press of that button.
     *
     * @throws org.rungtone.internal.InputError when a code does not fit, or there is neither a positive hold
     *     nor a button
     */
    public static SweepSpec of(int bits, int[] codes, double holdMillis, Optional<String> buttonPin) {
        return buttonPin.isPresent() ? onButton(bits, codes, buttonPin.get()) : holding(bits, codes, holdMillis);
    }

    /** Code width. */
    public int bits() {
        return bits;
    }

    /** A copy of the codes, in sweep order. */
    public int[] codes() {
        return codes.clone();
    }

    /** Hold time per code in milliseconds (0 with a button). */
    public double holdMillis() {
        return holdMillis;
    }

    /** Ticks each code is held: round(holdMillis · {@value #TICK_HZ} / 1000), at least 1. */
    public long holdTicks() {
        return Math.max(1, Math.round(holdMillis * TICK_HZ / 1000));
    }

    /** Steps of each pattern of a sweep for a recording; 0 for a plain sweep. */
    public int patternSteps() {
        return patternSteps;
    }

    /** Ticks each pattern step is held; 0 for a plain sweep. */
    public int patternTicks() {
        return patternTicks;
    }

    /** Ticks step {@code i} is held: a pattern step's or {@link #holdTicks()}. */
    public long ticksOf(int step) {
        boolean pattern = step < patternSteps || step >= codes.length - patternSteps;
        return pattern && patternSteps > 0 ? patternTicks : holdTicks();
    }

    /** The button pin as written, when the sweep advances on a button. */
    public Optional<String> buttonPin() {
        return buttonPin;
    }

    /** Ticks a button level must be stable: {@value #DEBOUNCE_MILLIS} ms at {@value #TICK_HZ} Hz. */
    public int debounceTicks() {
        return (int) Math.round(DEBOUNCE_MILLIS * TICK_HZ / 1000);
    }

    @Override
    public boolean equals(Object o) {
        return o instanceof SweepSpec s && s.bits == bits && Arrays.equals(s.codes, codes)
                && s.holdMillis == holdMillis && s.buttonPin.equals(buttonPin) && s.patternSteps == patternSteps
                && s.patternTicks == patternTicks;
    }

    @Override
    public int hashCode() {
        return Arrays.hashCode(codes) * 31 + buttonPin.hashCode();
    }

    @Override
    public String toString() {
        return "SweepSpec[" + codes.length + " codes, " + (buttonPin.isPresent() ? "button " + buttonPin.get()
                : "hold " + holdMillis + " ms") + (patternSteps > 0 ? ", patterns of " + patternSteps : "") + "]";
    }
}
