package org.rungtone.cli;

import java.io.PrintWriter;
import java.nio.file.Files;
import java.nio.file.Path;
import java.util.Locale;
import java.util.Map;
import java.util.concurrent.Callable;
import org.rungtone.firmware.CNames;
import org.rungtone.firmware.TargetFamily;
import org.rungtone.internal.AtomicFiles;
import org.rungtone.internal.Checks;
import org.rungtone.internal.InputError;
import picocli.CommandLine.Command;
import picocli.CommandLine.Mixin;
import picocli.CommandLine.Option;
import picocli.CommandLine.Parameters;
import picocli.CommandLine.Spec;

/** {@code rungtone init}: writes a commented starter project file. */
@Command(name = "init",
        header = "Write a commented starter project file.", mixinStandardHelpOptions = true,
        description = {"Write a commented starter project file for a target family and ladder. It asks nothing:",
            "every choice is an option, and the file explains each key so you can edit it."},
        footerHeading = "%nExample:%n",
        footer = {"  rungtone init doorbell.toml --target avr --topology r2r --bits 6 --name doorbell",
            "  rungtone build doorbell.toml"})
public final class InitCommand implements Callable<Integer> {
    /** Pins and clock that make a sensible start per family. */
    private static final Map<String, String[]> FAMILY = Map.of(
            "generic", new String[] {"PA0-PA%d", "", ""},
            "avr", new String[] {"PD%d-PD%d", "16MHz", "timer1"},
            "cortexm", new String[] {"PB0-PB%d", "72MHz", "systick"},
            "rp2040", new String[] {"GPIO0-GPIO%d", "", ""});

    @Spec
    picocli.CommandLine.Model.CommandSpec spec;

    @Mixin
    CommonOptions common;

    @Parameters(index = "0", paramLabel = "FILE", defaultValue = "rungtone.toml",
            description = "The project file to write (default ${DEFAULT-VALUE}).")
    Path file;

    @Option(names = "--target", paramLabel = "generic|avr|cortexm|rp2040", defaultValue = "generic",
            description = "Target family (default ${DEFAULT-VALUE}).")
    String target;

    @Option(names = "--topology", paramLabel = "weighted|r2r", defaultValue = "r2r",
            description = "Ladder topology (default ${DEFAULT-VALUE}).")
    String topology;

    @Option(names = "--bits", paramLabel = "<n>", defaultValue = "6",
            description = "Ladder bits (default ${DEFAULT-VALUE}).")
    int bits;

    @Option(names = "--name", paramLabel = "<name>", description = "Project name (default: from the file name).")
    String name;

    @Option(names = "--source", paramLabel = "<file>", defaultValue = "sound.wav",
            description = "The first sound's source, relative to the project file (default ${DEFAULT-VALUE}).")
    String source;

    @Option(names = "--force", description = "Overwrite an existing file.")
    boolean force;

    @Override
    public Integer call() {
        String family = TargetFamily.parse(target).name().toLowerCase(Locale.ROOT);
        String topo = topology.toLowerCase(Locale.ROOT);
        if (!topo.equals("r2r") && !topo.equals("weighted")) {
            throw new InputError("--topology must be weighted or r2r for a starter file: " + topology);
        }
        Checks.checkBits(bits);
        if (Files.exists(file) && !force) {
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
        String project = CNames.symbol(name != null ? name : stem);
        String text = render(project, family, topo);
        AtomicFiles.writeString(file, text);
        PrintWriter w = spec.commandLine().getOut();
        if (!common.quiet) {
            w.println("Wrote " + file + ". Put your sound next to it as " + source + ", check the pins and the"
                    + " ladder, then run:");
            w.println("  rungtone build " + file);
        }
        w.flush();
        return 0;
    }

    String render(String project, String family, String topo) {
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
        b.append("logic_high = \"").append(family.equals("cortexm") || family.equals("rp2040") ? "3.3V" : "5V")
                .append("\"\n");
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
        b.append("# loop    = \"0:end\"           # loop points, samples or times\n");
        return b.toString();
    }
}
