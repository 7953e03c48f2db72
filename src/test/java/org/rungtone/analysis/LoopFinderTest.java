package org.rungtone.analysis;

import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertTrue;

import java.util.Optional;
import org.junit.jupiter.api.Test;
import org.rungtone.source.Signal;
import org.rungtone.testing.SustainedSounds;

/**
 * Loops found in synthesized sustained sounds whose period is known by construction: the period within a
 * stated fraction, the loop a whole number of periods, the seam below a stated level; sounds with nothing
 * that repeats find no loop.
 */
class LoopFinderTest {
    private static final double RATE = 16_000;

    /** How far {@code periods} is from the nearest whole number. */
    private static double offWhole(double periods) {
        return Math.abs(periods - Math.rint(periods));
    }

    @Test
    void organToneLoopsOnWholePeriodsAfterItsAttack() {
        // 440 Hz with harmonics 2..4, a 15 ms attack and noise 70 dB down; the period is 16000/440 = 36.3636
        double truePeriod = RATE / 440;
        SeamlessLoop l = LoopFinder.find(Signal.wrap(SustainedSounds.organ(440, RATE, 2, -70, 1), RATE))
                .orElseThrow();
        assertEquals(truePeriod, l.periodSamples(), 0.001 * truePeriod, "period within 0.1 %");
        assertTrue(offWhole(l.lengthSamples() / truePeriod) < 0.01, () -> l + ": not whole periods");
        assertTrue(l.seamLevelDb() < -40, () -> l + ": seam too loud");
        // past the attack: 1 − e^(−t/15 ms) is within 0.1 % of its end after 105 ms
        assertTrue(l.start() >= 0.105 * RATE, () -> l + ": starts in the attack");
        // and before the 100 ms release at the end
        assertTrue(l.end() <= 1.9 * RATE, () -> l + ": runs into the release");
        assertEquals(8 * RATE / 1000, l.crossfadeSamples(), "8 ms crossfade");
    }

    @Test
    void organToneOffTheSampleGridStillLoopsOnWholePeriods() {
        // 441.3 Hz: no whole number of periods is a whole number of samples; the end is refined to the sample
        double truePeriod = RATE / 441.3;
        SeamlessLoop l = LoopFinder.find(Signal.wrap(SustainedSounds.organ(441.3, RATE, 2, -70, 1), RATE))
                .orElseThrow();
        assertEquals(truePeriod, l.periodSamples(), 0.001 * truePeriod);
        assertEquals(Math.rint(l.lengthSamples() / truePeriod), l.periods());
        // a whole number of periods lands within half a sample of the end chosen
        assertTrue(offWhole(l.lengthSamples() / truePeriod) * truePeriod <= 0.5, l::toString);
        assertTrue(l.seamLevelDb() < -40, l::toString);
    }

    @Test
    void mainsHumAt50HzIsFoundBelowTheMcLeodDetectorsFloor() {
        // 50 Hz with odd harmonics: period 320 samples exactly; TarsosDSP's MPM would report no pitch here
        SeamlessLoop l = LoopFinder.find(Signal.wrap(SustainedSounds.hum(50, RATE, 2), RATE)).orElseThrow();
        assertEquals(320, l.periodSamples(), 0.32);
        assertEquals(0, l.lengthSamples() % 320, l::toString);
        assertEquals(LoopCrossfade.FLOOR_DB, l.seamLevelDb(), 1e-9, "an exactly periodic hum leaves no seam");
        assertEquals(640, l.crossfadeSamples(), "two periods, longer than 8 ms");
    }

    @Test
    void sirenWithSlowVibratoLoopsOnWholeVibratoCycles() {
        // 700 Hz swinging ±3 % four times a second: the waveform repeats only every 0.25 s (4000 samples),
        // when the vibrato is back in phase and a whole number of carrier periods (175) has passed
        double truePeriod = RATE / 700;
        SeamlessLoop l = LoopFinder.find(Signal.wrap(SustainedSounds.siren(700, 0.03, 4, RATE, 3), RATE))
                .orElseThrow();
        assertEquals(0, l.lengthSamples() % 4000, () -> l + ": not whole vibrato cycles");
        assertEquals(truePeriod, l.periodSamples(), 0.001 * truePeriod, "mean period within 0.1 %");
        assertTrue(l.seamLevelDb() < -60, l::toString);
    }

    @Test
    void noiseHasNoRepeatingSection() {
        assertEquals(Optional.empty(), LoopFinder.find(Signal.wrap(SustainedSounds.noise(0.5, RATE, 2, 3), RATE)));
    }

    @Test
    void aToneThatDiesAwayHasNoRepeatingSection() {
        // 26 dB a second: no stretch long enough keeps its level within 3 dB at both ends of a loop
        double[] bell = new double[2 * (int) RATE];
        for (int i = 0; i < bell.length; i++) {
            bell[i] = 0.8 * Math.exp(-3.0 * i / RATE) * Math.sin(2 * Math.PI * 523.3 * i / RATE);
        }
        assertEquals(Optional.empty(), LoopFinder.find(Signal.wrap(bell, RATE)));
    }

    @Test
    void silenceHasNoRepeatingSection() {
        assertEquals(Optional.empty(), LoopFinder.find(Signal.wrap(new double[32_000], RATE)));
    }

    @Test
    void aLimitOnTheEndGivesTheBestLoopBeforeIt() {
        Signal organ = Signal.wrap(SustainedSounds.organ(440, RATE, 2, -70, 1), RATE);
        SeamlessLoop l = LoopFinder.find(organ, 8000).orElseThrow();
        assertTrue(l.end() <= 8000, l::toString);
        assertTrue(offWhole(l.lengthSamples() / (RATE / 440)) < 0.01, l::toString);
        assertTrue(l.seamLevelDb() < -40, l::toString);
    }

    @Test
    void aLimitTooEarlyForAnyLoopFindsNone() {
        Signal organ = Signal.wrap(SustainedSounds.organ(440, RATE, 2, -70, 1), RATE);
        assertEquals(Optional.empty(), LoopFinder.find(organ, 1000));
    }
}
