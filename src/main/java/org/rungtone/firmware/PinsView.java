package org.rungtone.firmware;

import java.util.ArrayList;
import java.util.List;

/**
 * Template values of the pin map: the ladder's ports, how a code becomes port values, the pin lookup tables
 * and the sweep's button.
 *
 * @param portType the C type of one port register ({@code uint8_t}, {@code uint16_t}, {@code uint32_t})
 * @param portCount how many ports the ladder uses
 * @param multiPort true for more than one port (the update has a glitch between ports)
 * @param portOrder the ports in update order, e.g. {@code B, D}
 * @param strategyText how a code becomes port values, in words
 * @param ports the ports in update order
 * @param tables the pin lookup tables (table strategy only; else empty)
 * @param button the sweep's step button, or null
 */
record PinsView(String portType, int portCount, boolean multiPort, String portOrder, String strategyText,
        List<PortView> ports, List<TableView> tables, ButtonView button) {
    private static final int PER_LINE = 16;

    /**
     * One port's lookup table: the port value of every code.
     *
     * @param name the port
     * @param maskHex the ladder pins of the port
     * @param table the C array body, one line per 16 entries (8 for 32-bit ports)
     */
    record TableView(String name, String maskHex, String table) {
    }

    /** The values of the plan's pin map. */
    static PinsView of(EmitPlan p) {
        PinMap map = p.pins;
        int width = map.portWidth();
        List<PortView> ports = new ArrayList<>();
        List<TableView> tables = new ArrayList<>();
        for (String port : map.ports()) {
            PortView v = PortView.of(p, port, ports.size());
            ports.add(v);
            if (p.strategy == PinStrategy.TABLE) {
                tables.add(new TableView(port, v.maskHex(), CLiterals.arrayBody(PinCode.table(map, port), width / 4,
                        width > 16 ? 8 : PER_LINE, "    ")));
            }
        }
        return new PinsView(width == 8 ? "uint8_t" : width == 16 ? "uint16_t" : "uint32_t", ports.size(),
                ports.size() > 1, String.join(", ", map.ports()), strategyText(p), List.copyOf(ports),
                List.copyOf(tables), p.button.map(ButtonView::of).orElse(null));
    }

    private static String strategyText(EmitPlan p) {
        switch (p.strategy) {
            case SHIFT:
                return "one mask and shift per port";
            case TABLE:
                return "one table read per port";
            default:
                return PinCode.termCount(p.pins) + " mask-and-shift terms";
        }
    }
}
