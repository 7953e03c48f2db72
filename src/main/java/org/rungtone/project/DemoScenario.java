package org.rungtone.project;

import java.io.IOException;
import java.io.InputStream;
import java.io.UncheckedIOException;
import java.nio.charset.StandardCharsets;
import java.util.LinkedHashMap;
import java.util.List;
import java.util.Map;
import org.rungtone.internal.InputError;

/**
 * The bundled greenhouse scenario (a door chime and a looping frost alarm on a calibrated 6-bit R-2R ladder of
 * an 8-bit AVR), as files to copy next to the outputs so that the user can change and rebuild them.
 */
public final class DemoScenario {
    /** The example folder the scenario comes from. */
    public static final String NAME = "greenhouse";
    /** The project file among {@link #FILES}. */
    public static final String PROJECT_FILE = "greenhouse.toml";
    /** The scenario's files. */
    public static final List<String> FILES = List.of(PROJECT_FILE, "door-chime.wav", "frost-alarm.rung",
            "greenhouse-1.unit.toml");

    private DemoScenario() {
    }

    /**
     * File name to bytes, in order; the project file builds into the folder above its copy ({@code out = ".."})
     * rather than next to the bundled original.
     *
     * @throws InputError when a file is missing from this build of Rungtone
     */
    public static Map<String, byte[]> files() {
        Map<String, byte[]> out = new LinkedHashMap<>();
        for (String f : FILES) {
            byte[] bytes = resource("examples/" + NAME + "/" + f);
            if (f.equals(PROJECT_FILE)) {
                bytes = new String(bytes, StandardCharsets.UTF_8).replaceFirst("(?m)^out\\s*=.*$", "out  = \"..\"")
                        .getBytes(StandardCharsets.UTF_8);
            }
            out.put(f, bytes);
        }
        return out;
    }

    private static byte[] resource(String name) {
        try (InputStream in = DemoScenario.class.getClassLoader().getResourceAsStream(name)) {
            if (in == null) {
                throw new InputError("the demo scenario file " + name + " is missing from this build of Rungtone");
            }
            return in.readAllBytes();
        } catch (IOException e) {
            throw new UncheckedIOException(e);
        }
    }
}
