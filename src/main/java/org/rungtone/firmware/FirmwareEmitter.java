package org.rungtone.firmware;

import java.nio.file.Path;
import java.util.ArrayList;
import java.util.LinkedHashMap;
import java.util.List;
import java.util.Map;
import org.rungtone.internal.AtomicFiles;

/**
 * Turns a {@link FirmwareRequest} into C99 for the target: {@code NAME.h} (the API, every sound's id, the
 * pin and table declarations), {@code NAME.c} (pin output, sample fetch, the playback engine, and on avr and
 * cortexm the pin, timer and interrupt set-up) and {@code NAME_data.c} (samples, sound table, pin tables,
 * sweep codes), rendered from {@code templates/<family>/}. All checks run before anything is written; the
 * output is byte-identical for the same request.
 */
public final class FirmwareEmitter {
    private FirmwareEmitter() {
    }

    /**
     * The rendered files and the report, without writing anything. The sample data is not held as text: it
     * is written straight to its file by {@link #write}.
     *
     * @param outputs file name to rendered template, header first
     * @param result the report; its {@code files} list is empty
     */
    public record Rendered(Map<String, Templates.Output> outputs, EmitResult result) {
        /** Copies the map, keeping its order. */
        public Rendered {
            outputs = java.util.Collections.unmodifiableMap(new LinkedHashMap<>(outputs));
        }

        /** File name to its whole text (the sample data formatted in memory: for tests and small sounds). */
        public Map<String, String> files() {
            Map<String, String> m = new LinkedHashMap<>();
            outputs.forEach((name, output) -> m.put(name, output.text()));
            return m;
        }
    }

    /**
     * Checks the request and renders the files.
     *
     * @throws org.rungtone.internal.InputError for the first problem with the request: unknown target, bad
     *     pins, unreachable rate, over the flash budget, a name that cannot become a C symbol, ...
     */
    public static Rendered render(FirmwareRequest request) {
        EmitPlan plan = EmitPlan.of(request);
        List<String> report = EmitReport.lines(plan);
        List<String> parameters = new ArrayList<>(report);
        parameters.addAll(request.settings());
        PlayerView view = PlayerView.of(plan, parameters);
        Templates t = request.templates();
        String h = plan.symbol + ".h";
        String c = plan.symbol + ".c";
        String d = plan.symbol + "_data.c";
        Map<String, Templates.Output> files = new LinkedHashMap<>();
        files.put(h, t.prepare(plan.folder, "player.h.mustache",
                view.forFile(h, "ladder-DAC player interface", true), view.streams()));
        files.put(c, t.prepare(plan.folder, "player.c.mustache", view.forFile(c, "ladder-DAC player", true),
                view.streams()));
        files.put(d, t.prepare(plan.folder, "data.c.mustache", view.forFile(d, "ladder-DAC player tables", false),
                view.streams()));
        EmitResult result = new EmitResult(List.of(), report, plan.totalBytes(), plan.timer, plan.strategy,
                plan.warnings, TickCost.of(plan), FirmwareFacts.of(plan));
        return new Rendered(files, result);
    }

    /**
     * Checks the request, renders the files and writes them into {@code outDir} (created if needed), each
     * through a temporary file and an atomic move.
     *
     * @throws org.rungtone.internal.InputError for a bad request (nothing is written) or an unusable folder
     */
    public static EmitResult emit(FirmwareRequest request, Path outDir) {
        return write(render(request), outDir);
    }

    /**
     * Writes rendered files into {@code outDir} (created if needed), each through a temporary file and an
     * atomic move.
     *
     * @throws org.rungtone.internal.InputError for an unusable folder
     */
    public static EmitResult write(Rendered r, Path outDir) {
        AtomicFiles.prepareFolder(outDir);
        List<Path> written = new ArrayList<>();
        for (Map.Entry<String, Templates.Output> f : r.outputs().entrySet()) {
            Path p = outDir.resolve(f.getKey());
            AtomicFiles.write(p, f.getValue()::writeTo);
            written.add(p);
        }
        EmitResult e = r.result();
        return new EmitResult(written, e.report(), e.flashBytes(), e.timer(), e.pinStrategy(), e.warnings(),
                e.tickCost(), e.facts());
    }
}
