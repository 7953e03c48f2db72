package org.rungtone.firmware;

import java.util.ArrayList;
import java.util.List;

/**
 * Template values of one ladder port.
 *
 * @param name the port's letter or number ({@code B}, {@code 1})
 * @param lower the name in lower case, for local variables
 * @param index the port's position in the update order
 * @param maskHex the ladder pins of the port as a fixed-width hex mask
 * @param pinList which pin carries which code bit, e.g. {@code PB0 = bit 0, PB1 = bit 1}
 * @param compute the C statement that computes the port's value from {@code code}
 * @param fullPort true when the ladder owns every pin of the port
 */
record PortView(String name, String lower, int index, String maskHex, String pinList, String compute,
        boolean fullPort) {
    /** The values of {@code port}, the {@code index}-th port of the plan's pin map. */
    static PortView of(EmitPlan p, String port, int index) {
        PinMap map = p.pins;
        int width = map.portWidth();
        long mask = map.mask(port);
        List<String> names = new ArrayList<>();
        for (Pin pin : map.pins()) {
            if (pin.port().equals(port)) {
                names.add(pin.name() + " = bit " + map.pins().indexOf(pin));
            }
        }
        return new PortView(port, PinCode.lower(port), index, CLiterals.hex(mask, width / 4), String.join(", ", names),
                p.family == TargetFamily.AVR ? PinCode.computeBytewise(map, p.strategy, port, p.symbol, p.macro)
                        : PinCode.compute(map, p.strategy, port, p.symbol, p.macro), mask == (1L << width) - 1);
    }
}
