package org.rungtone.firmware;

import java.util.ArrayList;
import java.util.List;

/**
 * The context of every player template ({@code player.h}, {@code player.c}, {@code data.c} and the partials
 * they include): the symbol prefixes and one view per part of the player. Templates name a part's values
 * through it, e.g. {@code {{timer.reload}}} or a section {@code {{#engine.clip}} ... {{/engine.clip}}}.
 *
 * @param symbol the C symbol prefix, e.g. {@code door_chime}
 * @param macro the macro prefix, the symbol in upper case
 * @param file the file being rendered
 * @param code the DAC code
 * @param pins the pin map
 * @param engine the playback engine and its tables
 * @param timer the tick and its timer
 * @param target what only one target family uses
 */
record PlayerView(String symbol, String macro, FileView file, CodeView code, PinsView pins, EngineView engine,
        TimerView timer, TargetView target) {
    /**
     * The file being rendered: its header comment.
     *
     * @param name the file's name, e.g. {@code door_chime.h}
     * @param role what the file is, e.g. {@code ladder-DAC player interface}
     * @param toolVersion the Rungtone version
     * @param parameters one "key: value" line per parameter of the build
     * @param caution true for the files that carry the caution about pin currents and speakers
     */
    record FileView(String name, String role, String toolVersion, List<String> parameters, boolean caution) {
    }

    /** The context of a plan; its file is named in {@link #forFile}. */
    static PlayerView of(EmitPlan p, List<String> parameters) {
        List<String> params = new ArrayList<>();
        for (String s : parameters) {
            params.add(s.replace("*/", "* /"));
        }
        FileView file = new FileView("", "", p.request.toolVersion(), List.copyOf(params), false);
        return new PlayerView(p.symbol, p.macro, file, CodeView.of(p.bits), PinsView.of(p), EngineView.of(p),
                TimerView.of(p), TargetView.of(p));
    }

    /** The same context for one file: its name, role and whether it carries the caution. */
    PlayerView forFile(String fileName, String role, boolean caution) {
        return new PlayerView(symbol, macro, new FileView(fileName, role, file.toolVersion(), file.parameters(),
                caution), code, pins, engine, timer, target);
    }

    /** The values written straight to the file rather than held as text. */
    List<Templates.Stream> streams() {
        return engine.samples() == null ? List.of() : List.of(engine.samples().data());
    }
}
