package org.rungtone.report;

import java.util.ArrayList;
import java.util.LinkedHashMap;
import java.util.List;
import java.util.Map;
import org.rungtone.firmware.FirmwareFacts;

/** The firmware part of the JSON reports: what the emitted player does, as fields. */
final class FirmwareJson {
    private FirmwareJson() {
    }

    /** Every fact of an emission. */
    static Map<String, Object> of(FirmwareFacts f) {
        Map<String, Object> m = new LinkedHashMap<>();
        m.put("name", f.name());
        m.put("family", f.family());
        m.put("cpu_clock_hz", Json.orNull(f.cpuClockHz()));
        m.put("engine", f.engine());
        m.put("tick", tick(f.tick()));
        m.put("pins", pins(f.pins()));
        m.put("storage", f.storage().map(FirmwareJson::storage).orElse(null));
        m.put("flash", flash(f.flash()));
        List<Map<String, Object>> sounds = new ArrayList<>();
        for (FirmwareFacts.Sound s : f.sounds()) {
            sounds.add(sound(s));
        }
        m.put("sounds", sounds);
        m.put("dds", f.dds().map(FirmwareJson::dds).orElse(null));
        m.put("sweep", f.sweep().map(FirmwareJson::sweep).orElse(null));
        m.put("tick_cost", f.tickCost().map(c -> {
            Map<String, Object> cm = new LinkedHashMap<>();
            cm.put("worst_cycles", c.worstCycles());
            cm.put("write_window_cycles", c.windowCycles());
            cm.put("timer_off_when_idle", c.idleOff());
            cm.put("cpu_share", f.cpuClockHz().isPresent()
                    ? c.cpuShare(f.cpuClockHz().getAsDouble(), f.tick().achievedHz()) : null);
            return cm;
        }).orElse(null));
        return m;
    }

    private static Map<String, Object> tick(FirmwareFacts.Tick t) {
        Map<String, Object> m = new LinkedHashMap<>();
        m.put("requested_hz", t.requestedHz());
        m.put("achieved_hz", t.achievedHz());
        m.put("timer_programmed", t.timerProgrammed());
        m.put("timer", t.timer().map(x -> {
            Map<String, Object> tm = new LinkedHashMap<>();
            tm.put("name", x.name());
            tm.put("clock_hz", x.clockHz());
            tm.put("prescaler", x.prescaler());
            tm.put("reload_register", x.reloadRegister());
            tm.put("reload", x.reload());
            tm.put("cycles_per_tick", x.cyclesPerTick());
            tm.put("error_ppm", x.errorPpm());
            return tm;
        }).orElse(null));
        return m;
    }

    private static Map<String, Object> pins(FirmwareFacts.Pins p) {
        Map<String, Object> m = new LinkedHashMap<>();
        m.put("notation", p.notation());
        m.put("port_width_bits", p.portWidthBits());
        m.put("by_bit", p.byBit());
        m.put("strategy", p.strategy());
        m.put("strategy_forced", p.strategyForced());
        m.put("write_order", p.writeOrder());
        m.put("gap_cycles", p.gapCycles());
        return m;
    }

    private static Map<String, Object> storage(FirmwareFacts.Storage s) {
        Map<String, Object> m = new LinkedHashMap<>();
        m.put("layout", s.layout());
        m.put("bytes", s.bytes());
        m.put("samples", s.samples());
        m.put("other_layout_bytes", s.otherLayoutBytes());
        return m;
    }

    private static Map<String, Object> flash(FirmwareFacts.Flash f) {
        Map<String, Object> m = new LinkedHashMap<>();
        m.put("sample_bytes", f.sampleBytes());
        m.put("sound_table_bytes", f.soundTableBytes());
        m.put("pin_table_bytes", f.pinTableBytes());
        m.put("sweep_code_bytes", f.sweepCodeBytes());
        m.put("total_bytes", f.totalBytes());
        m.put("budget_bytes", Json.orNull(f.budgetBytes()));
        return m;
    }

    private static Map<String, Object> sound(FirmwareFacts.Sound s) {
        Map<String, Object> m = new LinkedHashMap<>();
        m.put("id", s.id());
        m.put("symbol", s.symbol());
        m.put("samples", s.samples());
        m.put("duration_s", s.durationSeconds());
        m.put("start_index", s.startIndex());
        m.put("loop", s.loop().map(l -> {
            Map<String, Object> lm = new LinkedHashMap<>();
            lm.put("start", l.start());
            lm.put("end", l.end());
            lm.put("whole", l.whole());
            return lm;
        }).orElse(null));
        return m;
    }

    private static Map<String, Object> dds(FirmwareFacts.Oscillator d) {
        Map<String, Object> m = new LinkedHashMap<>();
        m.put("phase_bits", d.phaseBits());
        m.put("table_entries", d.tableEntries());
        m.put("resolution_hz", d.resolutionHz());
        m.put("requested_hz", d.requestedHz());
        m.put("tuning_word", d.tuningWord());
        m.put("actual_hz", d.actualHz());
        return m;
    }

    private static Map<String, Object> sweep(FirmwareFacts.Sweep s) {
        Map<String, Object> m = new LinkedHashMap<>();
        m.put("codes", s.codes());
        m.put("tick_hz", s.tickHz());
        m.put("hold_ms", Json.orNull(s.holdMillis()));
        m.put("hold_ticks", Json.orNull(s.holdTicks()));
        m.put("button_pin", s.buttonPin().orElse(null));
        m.put("debounce_ms", s.debounceMillis());
        return m;
    }
}
