package org.rungtone.testing;

import java.util.ArrayList;
import java.util.List;
import java.util.Locale;

/**
 * What an AVR program did in the simulator (see {@link AvrSimulator}): every write to a watched register and
 * every completed interrupt, in cycle order, as the harness {@code src/test/c/simavr-harness.c} prints them.
 *
 * @param writes register writes, in the order the program made them
 * @param interrupts completed interrupts, in order
 * @param output the harness's output as printed, for failure messages
 */
public record AvrTrace(List<Write> writes, List<Interrupt> interrupts, String output) {
    /** Copies the lists. */
    public AvrTrace {
        writes = List.copyOf(writes);
        interrupts = List.copyOf(interrupts);
    }

    /**
     * One write to a register.
     *
     * @param cycle the CPU cycle at which the writing instruction starts
     * @param register the datasheet name: {@code PORTB}, {@code DDRD}, {@code PINC}, {@code GPIOR0}
     * @param value the byte written
     */
    public record Write(long cycle, String register, int value) {
    }

    /**
     * One interrupt, from its vector to the end of its RETI.
     *
     * @param entryCycle the cycle of the first instruction at the vector
     * @param cycles its length in cycles, including the four-cycle interrupt response
     */
    public record Interrupt(long entryCycle, long cycles) {
        /** The first cycle after the interrupt's RETI. */
        public long exitCycle() {
            return entryCycle + cycles - AvrSimulator.RESPONSE_CYCLES;
        }

        /** True when {@code write} happened inside this interrupt. */
        public boolean contains(Write write) {
            return write.cycle() >= entryCycle && write.cycle() < exitCycle();
        }
    }

    /**
     * Parses the harness's output.
     *
     * @throws IllegalArgumentException for a line of no known shape, or when the closing summary is missing
     */
    public static AvrTrace parse(String output) {
        List<Write> writes = new ArrayList<>();
        List<Interrupt> interrupts = new ArrayList<>();
        boolean summary = false;
        for (String line : output.split("\n")) {
            String[] f = line.trim().split(" ");
            if (f.length == 3 && f[0].equals("isr")) {
                interrupts.add(new Interrupt(Long.parseLong(f[1]), Long.parseLong(f[2])));
            } else if (f.length == 3 && f[2].startsWith("0x")) {
                writes.add(new Write(Long.parseLong(f[0]), f[1], Integer.parseInt(f[2].substring(2), 16)));
            } else if (f[0].equals("summary")) {
                summary = true;
            } else if (!line.isBlank()) {
                throw new IllegalArgumentException("unexpected harness output line: " + line);
            }
        }
        if (!summary) {
            throw new IllegalArgumentException("the harness printed no summary:\n" + output);
        }
        return new AvrTrace(writes, interrupts, output);
    }

    /** The writes to {@code register}, in order. */
    public List<Write> writesTo(String register) {
        return writes.stream().filter(w -> w.register().equals(register)).toList();
    }

    /** The cycle of the first write of {@code value} to {@code register}; fails when there is none. */
    public long marker(String register, int value) {
        return writes.stream().filter(w -> w.register().equals(register) && w.value() == value)
                .mapToLong(Write::cycle).findFirst().orElseThrow(() -> new AssertionError(String.format(
                        Locale.ROOT, "no write of %d to %s in the trace:%n%s", value, register, output)));
    }
}
