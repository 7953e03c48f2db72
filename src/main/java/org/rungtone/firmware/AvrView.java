package org.rungtone.firmware;

import java.util.ArrayList;
import java.util.List;

/**
 * Template values of the AVR player (register names of the ATmega328P): the clock it was made for, the
 * Timer/Counter in CTC mode, its clock-select bits and interrupt vector, and the flash reads of its tables.
 *
 * @param cpuClockHz the CPU clock in whole hertz (checked against F_CPU)
 * @param cpuClockText the CPU clock in words, e.g. {@code 16 MHz}
 * @param timer0 true when Timer/Counter0 paces the player
 * @param timer1 true when Timer/Counter1 paces the player
 * @param timer2 true when Timer/Counter2 paces the player
 * @param clockSelect the CSn2:0 bits of the prescaler, e.g. {@code (_BV(CS11) | _BV(CS10))}
 * @param vector the compare-match interrupt vector, e.g. {@code TIMER1_COMPA_vect}
 * @param reads the flash reads of the tables
 * @param isr the whole timer interrupt in assembler ({@link AvrFastTick}, {@link AvrTreadTick}), or null (its
 *     section is false) when the interrupt is the compiled C tick
 */
record AvrView(long cpuClockHz, String cpuClockText, boolean timer0, boolean timer1, boolean timer2,
        String clockSelect, String vector, Reads reads, String isr) {
    /**
     * The avr-libc flash read of each table, sized to its entries.
     *
     * @param sample {@code pgm_read_byte} or {@code pgm_read_word} for one sample
     * @param index {@code pgm_read_word} or {@code pgm_read_dword} for one sample index
     * @param stepCode {@code pgm_read_byte} or {@code pgm_read_word} for one sweep code
     * @param take the LPM instructions that read one whole-element code and step the Z pointer past it
     */
    record Reads(String sample, String index, String stepCode, String take) {
    }

    /** The values of an avr plan. */
    static AvrView of(EmitPlan p) {
        TimerSetting t = p.timer.orElseThrow();
        TimerKind k = t.kind();
        boolean wordSamples = p.storage != SampleStorage.PACKED && p.bits > 8;
        Reads reads = new Reads(wordSamples ? "pgm_read_word" : "pgm_read_byte",
                p.wideIndex ? "pgm_read_dword" : "pgm_read_word", p.bits > 8 ? "pgm_read_word" : "pgm_read_byte",
                p.bits > 8 ? "lpm %A0, Z+\\n\\tlpm %B0, Z+" : "lpm %0, Z+");
        return new AvrView(Math.round(p.request.cpuClockHz()), Fmt.hz(p.request.cpuClockHz()),
                k == TimerKind.AVR_TIMER0, k == TimerKind.AVR_TIMER1, k == TimerKind.AVR_TIMER2,
                clockSelect(k, t.prescaler()), "TIMER" + timerNumber(k) + "_COMPA_vect", reads,
                AvrFastTick.isr(p).or(() -> AvrTreadTick.isr(p)).orElse(null));
    }

    /**
     * The CSn2:0 clock-select bits for a prescaler, as in the ATmega328P datasheet tables "Clock Select Bit
     * Description": timers 0 and 1 select 1, 8, 64, 256, 1024 with values 1..5; timer 2 selects 1, 8, 32,
     * 64, 128, 256, 1024 with values 1..7.
     */
    static String clockSelect(TimerKind k, int prescaler) {
        // the timer's prescalers in ascending order are exactly the datasheet's clock-select values 1, 2, ...
        int[] order = k.prescalers().toArray();
        int value = 0;
        for (int i = 0; i < order.length; i++) {
            if (order[i] == prescaler) {
                value = i + 1;
            }
        }
        char n = timerNumber(k);
        List<String> bits = new ArrayList<>();
        for (int b = 2; b >= 0; b--) {
            if ((value >> b & 1) != 0) {
                bits.add("_BV(CS" + n + b + ")");
            }
        }
        return bits.size() == 1 ? bits.get(0) : "(" + String.join(" | ", bits) + ")";
    }

    /** The n of Timer/Countern: the digit of {@code timer1}. */
    private static char timerNumber(TimerKind k) {
        return k.optionName().charAt(5);
    }
}
