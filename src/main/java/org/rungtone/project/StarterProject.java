package org.rungtone.project;

import java.nio.file.Files;
import java.nio.file.Path;
import java.util.Locale;
import java.util.Map;
import java.util.Optional;
import org.rungtone.firmware.CNames;
import org.rungtone.firmware.TargetFamily;
import org.rungtone.internal.Checks;
import org.rungtone.internal.InputError;

/** A commented starter project file for a target family and ladder, every key explained. */
public final class StarterProject {
    /** Pins and clock that make a sensible start per family. */
    private static final Map<String, String[]> FAMILY = Map.of(
            "generic", new String[] {"PA0-PA%d", "", ""},
            "avr", new String[] {"PD%d-PD%d", "16MHz", "timer1"},
            "cortexm", new String[] {"PB0-PB%d", "72MHz", "systick"},
            "rp2040", new String[] {"GPIO0-GPIO%d", "", ""});

    private StarterProject() {
    }

    /**
     * What to start with.
     *
     * @param file the project file to write
     * @param target the target family's name
     * @param topology weighted or r2r
     * @param bits ladder bits
     * @param name the project's name, else from the file name
     * @param source the first sound's source, relative to the file
     * @param force overwrite an existing file
     */
    public record Request(Path file, String target, String topology, int bits, Optional<String> name, String source,
            boolean force) {
    }

    /**
     * The file's text, after checking that it may be written.
     *
     * @throws InputError for a family, topology or bit depth it cannot start with, or a file that exists
     *     (without force) or cannot be written
     */
    public static String text(Request r) {
        String family = TargetFamily.parse(r.target()).name().toLowerCase(Locale.ROOT);
        String topo = r.topology().toLowerCase(Locale.ROOT);
        if (!topo.equals("r2r") && !topo.equals("weighted")) {
            throw new InputError("--topology must be weighted or r2r for a starter file: " + r.topology());
        }
        Checks.checkBits(r.bits());
        Path file = r.file();
        if (Files.exists(file) && !r.force()) {
            throw new InputError(file + ": already exists; use --force to overwrite it");
        }
        for (Path p = file.toAbsolutePath().getParent(); p != null; p = p.getParent()) {
            if (Files.exists(p)) {
                Checks.checkInput(Files.isDirectory(p), "%s: cannot be written, %s is a file; choose another path",
                        file, p);
                break;
            }
        }
        String stem = file.getFileName().toString().replaceFirst("\\.toml$", "");
        return render(r, CNames.symbol(r.name().orElse(stem)), family, topo);
    }

    private static String render(Request r, String project, String family, String topo) {
        int bits = r.bits();
        String source = r.source();
        Path file = r.file();
        String[] f = FAMILY.get(family);
        // AVR: keep PD0/PD1 free for the serial port when the ladder fits on PD2..PD7
        String pins = family.equals("avr") ? (bits <= 6 ? String.format(Locale.ROOT, f[0], 2, bits + 1)
                : String.format(Locale.ROOT, f[0], 0, bits - 1)) : String.format(Locale.ROOT, f[0], bits - 1);
        StringBuilder b = new StringBuilder();
        b.append("# Rungtone project: ").append(project).append('\n');
        b.append("# Build it with: rungtone build ").append(file.getFileName()).append("\n");
        b.append("# Paths are relative to this file. Values take units: \"16k\", \"250ms\", \"4k7\", \"5%\".\n");
        b.append("# Caution: keep every pin's current within the part's datasheet limits, and never drive a\n");
        b.append("# speaker straight from the pins or a bare op-amp: use an amplifier.\n\n");
        b.append("[project]\n");
        b.append("name = \"").append(project).append("\"          # C symbol prefix and output folder name\n");
        b.append("# out  = \"rungtone-out/").append(project).append("\"   # output folder\n");
        b.append("seed = 1                     # dither seed: same inputs and seed, same output bytes\n");
        b.append("# unit = \"board-1.toml\"      # measured unit profile from 'rungtone calibrate fit'\n");
        b.append("compensation = true          # quantize onto the board's real levels\n\n");
        b.append("[target]\n");
        b.append("family    = \"").append(family).append("\"          # generic | avr | cortexm | rp2040\n");
        if (!f[1].isEmpty()) {
            b.append("cpu_clock = \"").append(f[1]).append("\"         # the timer reload is computed from it\n");
            b.append("timer     = \"").append(f[2]).append("\"\n");
        }
        b.append("pins      = \"").append(pins).append("\"          # one pin per bit, bit 0 (LSB) first\n");
        b.append("storage   = \"unpacked\"       # unpacked | packed (bit-packed codes save flash)\n");
        b.append("# flash_budget = \"28k\"       # refuse to build past this many bytes of samples\n\n");
        b.append("[ladder]\n");
        b.append("topology   = \"").append(topo).append("\"            # weighted | r2r | custom\n");
        b.append("bits       = ").append(bits).append('\n');
        if (topo.equals("r2r")) {
            b.append("base_r     = \"10k\"            # R of the ladder; legs and termination are 2R\n");
        } else {
            b.append("# resistors = [\"80k\", \"40k\", ...]   # per bit, bit 0 first; default: base_r x 2^(N-1-i)\n");
            b.append("base_r     = \"10k\"            # the MSB resistor\n");
        }
        b.append("series     = \"E24\"            # snap values to this preferred series\n");
        b.append("tolerance  = \"5%\"\n");
        boolean lowVoltage = family.equals("cortexm") || family.equals("rp2040");
        b.append("logic_high = \"").append(lowVoltage ? "3.3V" : "5V").append("\"\n");
        b.append("pin_r_high = \"25\"             # pin output resistance, ohms (see the datasheet)\n");
        b.append("pin_r_low  = \"20\"\n\n");
        b.append("[quantize]\n");
        b.append("rate   = \"16k\"                # sample rate of every sound\n");
        b.append("dither = \"tpdf\"               # none | rpdf | tpdf\n");
        b.append("# shaping = \"first\"           # none | first | second (noise shaping)\n\n");
        b.append("[preview]\n");
        b.append("filter = \"lp2:6k\"             # none | rc:HZ | lp2:HZ[:Q], the filter after the DAC\n\n");
        b.append("[[sound]]\n");
        b.append("name      = \"sound\"\n");
        b.append("source    = \"").append(source).append("\"     # .wav or .rung\n");
        b.append("trim      = -60                # drop leading/trailing audio below -60 dBFS\n");
        b.append("fade_out  = \"20ms\"\n");
        b.append("# loop    = \"0:end\"           # loop points, samples or times, or \"auto\" to find one\n");
        return b.toString();
    }
}
