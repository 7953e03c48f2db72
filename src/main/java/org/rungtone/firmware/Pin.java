package org.rungtone.firmware;

import java.util.Comparator;
import org.rungtone.internal.Checks;

/**
 * One GPIO pin: a port name (a letter such as {@code B}, or a number such as {@code 1} for parts that number
 * their ports) and a pin number on that port. Written the way the part's datasheet names it: {@code PB3},
 * {@code P1.3}.
 *
 * @param port upper-case letter or decimal number
 * @param pin pin number, 0 = least significant bit of the port register
 */
public record Pin(String port, int pin) {
    /** Orders ports the way emitted code updates them: letters alphabetically, then numbers by value. */
    public static final Comparator<String> PORT_ORDER = Comparator
            .comparing((String p) -> Character.isDigit(p.charAt(0)))
            .thenComparing(p -> Character.isDigit(p.charAt(0)) ? Integer.parseInt(p) : 0)
            .thenComparing(Comparator.naturalOrder());

    /** Checks the fields. */
    public Pin {
        Checks.checkArgument(port != null && !port.isEmpty(), "port name is empty");
        Checks.checkArgument(pin >= 0 && pin < 32, "pin number must be 0..31: %d", pin);
    }

    /** True when the port is named by a number ({@code P1.3}) rather than a letter ({@code PB3}). */
    public boolean numberedPort() {
        return Character.isDigit(port.charAt(0));
    }

    /** The pin as the datasheet writes it: {@code PB3} or {@code P1.3}. */
    public String name() {
        return numberedPort() ? "P" + port + "." + pin : "P" + port + pin;
    }

    @Override
    public String toString() {
        return name();
    }
}
