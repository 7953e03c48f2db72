package org.rungtone.firmware;

import java.util.Comparator;
import org.rungtone.internal.Checks;

/**
 * One GPIO pin: a port name (a letter such as {@code B}, a number such as {@code 1} for parts that number
 * their ports, or {@link #GPIO_BANK} for parts with one bank of numbered GPIOs) and a pin number on that port.
 * Written the way the part's datasheet names it: {@code PB3}, {@code P1.3}, {@code GPIO3}.
 *
 * @param port upper-case letter, decimal number or {@link #GPIO_BANK}
 * @param pin pin number, 0 = least significant bit of the port register
 */
public record Pin(String port, int pin) {
    /** The one bank of a part whose datasheet names its pins GPIO0, GPIO1, ... (the RP2040). */
    public static final String GPIO_BANK = "GPIO";

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

    /** True for a pin of the {@link #GPIO_BANK}, written {@code GPIO3}. */
    public boolean bankPin() {
        return port.equals(GPIO_BANK);
    }

    /** The pin as the datasheet writes it: {@code PB3}, {@code P1.3} or {@code GPIO3}. */
    public String name() {
        return name(port, Integer.toString(pin));
    }

    /** A pin name from its port and the digits of its number, as {@link #name()} writes it. */
    static String name(String port, String digits) {
        if (port.equals(GPIO_BANK)) {
            return GPIO_BANK + digits;
        }
        return Character.isDigit(port.charAt(0)) ? "P" + port + "." + digits : "P" + port + digits;
    }

    @Override
    public String toString() {
        return name();
    }
}
