package org.rungtone.firmware;

/**
 * The update of one port for one code: the pins in {@code mask} take the levels in {@code value}; every
 * other pin of the port keeps its level. {@code value} never has bits outside {@code mask}.
 *
 * @param port port name
 * @param value pin levels (bit p = pin p)
 * @param mask the pins of the ladder on this port
 */
public record PortWrite(String port, long value, long mask) {
    /** Pins to drive high: for a set register (the low half of a BSRR-style register). */
    public long setBits() {
        return value;
    }

    /** Pins to drive low: for a clear register (the high half of a BSRR-style register). */
    public long clearBits() {
        return mask & ~value;
    }
}
