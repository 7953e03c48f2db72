package org.rungtone.firmware;

/**
 * Template values of the sweep's step button.
 *
 * @param pin the pin as the datasheet names it, e.g. {@code PC5}
 * @param port the pin's port ({@code C})
 * @param bit the pin's number on its port
 */
record ButtonView(String pin, String port, int bit) {
    /** The values of {@code button}. */
    static ButtonView of(Pin button) {
        return new ButtonView(button.name(), button.port(), button.pin());
    }
}
