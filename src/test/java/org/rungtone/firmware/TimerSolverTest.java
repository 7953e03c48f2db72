package org.rungtone.firmware;

import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertThrows;

import org.junit.jupiter.api.Test;
import org.rungtone.internal.InputError;
import org.rungtone.internal.Setting;
import org.rungtone.internal.SettingError;

class TimerSolverTest {
    @Test
    void avrTimer1At16MHzFor22050Hz() {
        // Hand computation: f = 16 MHz / (p * (OCR1A + 1)).
        //   p = 1: 16,000,000 / 22,050 = 725.62 -> period 726: 22,038.567 Hz, -518.48 ppm
        //                                       period 725: 22,068.966 Hz, +860.11 ppm
        //   p = 8: 90.70 -> period 91: 21,978.02 Hz, -3,264 ppm; larger prescalers are coarser still.
        // Best: prescaler 1, OCR1A = 725, 22,038.567 Hz, -518.48 ppm.
        TimerSetting s = TimerSolver.solve(16e6, TimerKind.AVR_TIMER1, 22050, 1000);
        assertEquals(1, s.prescaler());
        assertEquals(725, s.reload());
        assertEquals(726, s.cyclesPerTick());
        assertEquals(22038.5675, s.achievedHz(), 1e-4);
        assertEquals(-518.481, s.errorPpm(), 1e-3);
    }

    @Test
    void avrTimer0HitsEightKilohertzExactly() {
        // 16 MHz / 8 kHz = 2000 cycles: too many for an 8-bit counter at p = 1; p = 8 gives 250 exactly.
        TimerSetting s = TimerSolver.solve(16e6, TimerKind.AVR_TIMER0, 8000, 0);
        assertEquals(8, s.prescaler());
        assertEquals(249, s.reload());
        assertEquals(0, s.errorPpm(), 1e-9);
    }

    @Test
    void sysTickAt72MHzFor44100Hz() {
        // 72,000,000 / 44,100 = 1632.65 -> period 1633 (SYST_RVR = 1632): 44,090.631 Hz, -212.45 ppm;
        // period 1632 would give +400.2 ppm.
        TimerSetting s = TimerSolver.solve(72e6, TimerKind.SYSTICK, 44100, 1000);
        assertEquals(1, s.prescaler());
        assertEquals(1632, s.reload());
        assertEquals(-212.455, s.errorPpm(), 1e-3);
    }

    @Test
    void generalTimerPicksTheSmallestExactPrescaler() {
        // 1 Hz from 84 MHz needs p * period = 84,000,000 with period <= 65,536: the smallest divisor of
        // 84,000,000 = 2^8 * 3 * 5^6 * 7 that leaves a period of at most 65,536 is 1,344 (period 62,500).
        TimerSetting s = TimerSolver.solve(84e6, TimerKind.GENERAL16, 1, 0);
        assertEquals(1344, s.prescaler());
        assertEquals(62499, s.reload());
        assertEquals(0, s.errorPpm(), 1e-9);
    }

    @Test
    void rp2040AlarmCarriesTheFractionOfAMicrosecond() {
        // 10^6 / 22,050 = 20,000 / 441 = 45 + 155/441 us: the ticks average 22,050 Hz exactly
        TimerSetting s = TimerSolver.solve(AlarmPeriod.COUNT_HZ, TimerKind.RP2040_ALARM, 22050, 0);
        assertEquals(44, s.reload());
        assertEquals(45, s.cyclesPerTick());
        assertEquals(22050, s.achievedHz(), 0);
        assertEquals(new AlarmPeriod(45, 155, 441, 22_050_000), AlarmPeriod.of(22050));
        assertEquals("alarm on the 1 MHz microsecond count: ALARM0 += 45 155/441 µs (45 or 46 µs apart) per"
                + " tick, 22.05 kHz on average (+0.0 ppm)", s.describe());
        // 8 kHz is 125 us exactly; the CPU clock given does not matter
        assertEquals(new AlarmPeriod(125, 0, 1, 8_000_000), AlarmPeriod.of(8000));
        assertEquals(124, TimerSolver.solve(125e6, TimerKind.RP2040_ALARM, 8000, 0).reload());
        // a rate with millihertz: 22,038.567 Hz is 10^9 / 22,038,567 us, to the millihertz exactly
        AlarmPeriod odd = AlarmPeriod.of(22038.567);
        assertEquals(45, odd.wholeMicros());
        assertEquals(22_038_567, odd.rateMilliHz());
        assertEquals(22038.567, odd.achievedHz(), 0);
    }

    @Test
    void refusesARateTheAlarmCannotMake() {
        assertEquals("quantize.rate 600 kHz is too fast for alarm (a 32-bit alarm on the 1 MHz microsecond count):"
                + " the fastest is 500 kHz; lower quantize.rate", assertThrows(InputError.class,
                        () -> TimerSolver.solve(1e6, TimerKind.RP2040_ALARM, 600e3, 1000)).getMessage());
    }

    @Test
    void refusesARateOutsideTheTimersRange() {
        // slowest: 16 MHz / (1024 * 256) = 61.035 Hz
        assertEquals("quantize.rate 10 Hz is too slow for timer0 (8-bit, prescalers 1/8/64/256/1024) at a 16 MHz"
                + " clock: the slowest is 61.0352 Hz; choose a wider target.timer or a higher quantize.rate",
                assertThrows(InputError.class, () -> TimerSolver.solve(16e6, TimerKind.AVR_TIMER0, 10, 1000))
                        .getMessage());
        assertEquals("quantize.rate 10 MHz is too fast for systick (24-bit, no prescaler) at a 16 MHz clock: the"
                + " fastest is 8 MHz; lower quantize.rate or raise target.cpu_clock",
                assertThrows(InputError.class, () -> TimerSolver.solve(16e6, TimerKind.SYSTICK, 10e6, 1000))
                        .getMessage());
    }

    @Test
    void refusesWhenNothingIsWithinTolerance() {
        assertEquals("quantize.rate 22.05 kHz cannot be made within 100 ppm by timer1 (16-bit, prescalers"
                + " 1/8/64/256/1024) at a 16 MHz clock: the closest is 22.0386 kHz (-518.5 ppm, prescaler 1,"
                + " OCR1A = 725); use quantize.rate 22038.567 or raise target.rate_tolerance",
                assertThrows(InputError.class, () -> TimerSolver.solve(16e6, TimerKind.AVR_TIMER1, 22050, 100))
                        .getMessage());
    }

    @Test
    void errorsNameTheirSettingsWhereverTheUserTypedThem() {
        SettingError e = assertThrows(SettingError.class, () -> TimerSolver.solve(16e6, TimerKind.SYSTICK, 10e6,
                1000));
        assertEquals(Setting.RATE, e.setting());
        // the command line's names (cli.OptionNames): the option's text stays what it always was
        assertEquals("--rate 10 MHz is too fast for systick (24-bit, no prescaler) at a 16 MHz clock: the fastest"
                + " is 8 MHz; lower --rate or raise --cpu-clock", e.render(TimerSolverTest::optionName));
    }

    /** A setting's option as the command line spells most of them: {@code target.cpu_clock} is --cpu-clock. */
    static String optionName(Setting s) {
        return "--" + s.key().substring(s.key().indexOf('.') + 1).replace('_', '-');
    }

    @Test
    void describesTheSetting() {
        assertEquals("timer1 at 16 MHz: prescaler 1, OCR1A = 725 (726 cycles per tick), 22.0386 kHz (-518.5 ppm)",
                TimerSolver.solve(16e6, TimerKind.AVR_TIMER1, 22050, 1000).describe());
        assertEquals("general16 at 84 MHz: prescaler 1344 (PSC = 1343), ARR = 62499 (84000000 cycles per tick), 1 Hz"
                + " (+0.0 ppm)", TimerSolver.solve(84e6, TimerKind.GENERAL16, 1, 0).describe());
    }

    @Test
    void parsesTimerNames() {
        assertEquals(TimerKind.AVR_TIMER2, TimerKind.parse("Timer2"));
        assertEquals("target.timer 'tc3' is unknown; use one of timer0, timer1, timer2, systick, general16,"
                + " general32, alarm",
                assertThrows(InputError.class, () -> TimerKind.parse("tc3")).getMessage());
        // the former spellings get the new name
        assertEquals("target.timer 'TIM32' is now called general32 (a general-purpose timer with a 32-bit counter)",
                assertThrows(InputError.class, () -> TimerKind.parse("TIM32")).getMessage());
    }
}
