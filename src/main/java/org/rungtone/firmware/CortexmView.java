package org.rungtone.firmware;

import java.util.ArrayList;
import java.util.List;

/**
 * Template values of the Cortex-M player: the GPIO ports to clock and their MODER bits, SysTick or the
 * general-purpose timer with its default addresses, and the button's pull-up. Defaults are those of an
 * STM32F4 (RM0090): TIM2 is 32-bit at 0x40000000, IRQ 28; TIM3 16-bit at 0x40000400, IRQ 29; GPIO port n is
 * clocked by bit n of RCC_AHB1ENR.
 *
 * @param gpioPorts every port the player uses (ladder and button), with its offset from GPIOA
 * @param gpioClockBits the RCC_AHB1ENR bits of those ports, in hex
 * @param portModes the MODER bits of each ladder port
 * @param systick true when SysTick paces the player
 * @param generalTimer the general-purpose timer that paces the player, or null
 * @param button the button's MODER and PUPDR bits, or null
 */
record CortexmView(List<GpioPort> gpioPorts, String gpioClockBits, List<PortMode> portModes, boolean systick,
        GeneralTimer generalTimer, Button button) {
    /**
     * A GPIO port to clock.
     *
     * @param name the port's letter
     * @param offset its distance from GPIOA in ports (A = 0)
     */
    record GpioPort(String name, int offset) {
    }

    /**
     * The MODER bits of one ladder port.
     *
     * @param name the port's letter
     * @param moderMask the two MODER bits of every ladder pin
     * @param moderOut the value 01 (output) in those bits
     */
    record PortMode(String name, String moderMask, String moderOut) {
    }

    /**
     * The general-purpose timer's defaults.
     *
     * @param name the timer, {@code TIM2} (32-bit) or {@code TIM3} (16-bit)
     * @param base its base address
     * @param irq its interrupt number
     * @param clockBit its enable bit in RCC_APB1ENR
     */
    record GeneralTimer(String name, String base, int irq, int clockBit) {
    }

    /**
     * The button pin's input set-up.
     *
     * @param port the pin's port
     * @param moderMask the pin's two MODER bits (00 = input)
     * @param pullUp the value 01 (pull-up) in the pin's two PUPDR bits
     */
    record Button(String port, String moderMask, String pullUp) {
    }

    /** The values of a cortexm plan. */
    static CortexmView of(EmitPlan p) {
        List<String> names = new ArrayList<>(p.pins.ports());
        p.button.filter(b -> !names.contains(b.port())).ifPresent(b -> names.add(b.port()));
        List<GpioPort> gpio = new ArrayList<>();
        long clockBits = 0;
        for (String port : names) {
            int offset = port.charAt(0) - 'A';
            clockBits |= 1L << offset;
            gpio.add(new GpioPort(port, offset));
        }
        List<PortMode> modes = new ArrayList<>();
        for (String port : p.pins.ports()) {
            long mask = p.pins.mask(port);
            long moderMask = 0;
            long moderOut = 0;
            for (int pin = 0; pin < 16; pin++) {
                if ((mask >> pin & 1) != 0) {
                    moderMask |= 3L << (2 * pin);
                    moderOut |= 1L << (2 * pin);
                }
            }
            modes.add(new PortMode(port, CLiterals.hex(moderMask, 8), CLiterals.hex(moderOut, 8)));
        }
        TimerKind k = p.timer.orElseThrow().kind();
        boolean wide = k == TimerKind.GENERAL32;
        GeneralTimer general = k == TimerKind.SYSTICK ? null
                : new GeneralTimer(wide ? "TIM2" : "TIM3", wide ? "0x40000000" : "0x40000400", wide ? 28 : 29,
                        wide ? 0 : 1);
        Button button = p.button.map(b -> new Button(b.port(), CLiterals.hex(3L << (2 * b.pin()), 8),
                CLiterals.hex(1L << (2 * b.pin()), 8))).orElse(null);
        return new CortexmView(List.copyOf(gpio), CLiterals.hex(clockBits, 8), List.copyOf(modes),
                k == TimerKind.SYSTICK, general, button);
    }
}
