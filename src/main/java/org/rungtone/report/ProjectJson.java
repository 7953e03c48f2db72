package org.rungtone.report;

import java.nio.file.Path;
import java.util.LinkedHashMap;
import java.util.Map;

/**
 * The project report for machines ({@code docs/schema/project.schema.json}): the project, each effective
 * setting as {@code {"value": ..., "origin": ...}}, every sound's build fields, the player and the files.
 */
final class ProjectJson {
    private ProjectJson() {
    }

    /** The whole report. */
    static Map<String, Object> of(ProjectReport.Input in) {
        Path base = in.outDir();
        Map<String, Object> m = Json.header("project", in.toolVersion());
        m.put("project", in.name());
        m.put("file", Json.path(in.file(), base));
        m.put("settings", settings(in.settings(), base));
        m.put("sounds", in.sounds().stream().map(s -> BuildJson.sound(s, base)).toList());
        m.put("firmware", in.firmwareFacts().map(FirmwareJson::of).orElse(null));
        m.put("flash_bytes", in.flashBytes());
        m.put("flash_budget_bytes", in.flashBudgetBytes() > 0 ? in.flashBudgetBytes() : null);
        m.put("files", Json.paths(in.files(), base));
        m.put("warnings", ProjectReport.warnings(in));
        return m;
    }

    /**
     * Each setting as its value and origin, keyed as the text report names it with underscores for spaces
     * ("flash budget" gives its bytes as {@code flash_budget_bytes}); a path value is relative to {@code base}.
     */
    static Map<String, Object> settings(Map<String, ProjectSetting> settings, Path base) {
        Map<String, Object> m = new LinkedHashMap<>();
        settings.forEach((key, s) -> {
            Map<String, Object> e = new LinkedHashMap<>();
            e.put("value", s.value() instanceof Path p ? Json.path(p, base) : s.value());
            e.put("origin", s.origin().key());
            m.put(key.equals("flash budget") ? "flash_budget_bytes" : key.replace(' ', '_'), e);
        });
        return m;
    }
}
