package org.rungtone.cli;

import static org.junit.jupiter.api.Assertions.assertArrayEquals;
import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertFalse;
import static org.junit.jupiter.api.Assertions.assertTrue;

import com.google.gson.JsonObject;
import com.google.gson.JsonParser;
import java.io.IOException;
import java.io.PrintWriter;
import java.io.StringWriter;
import java.nio.file.Files;
import java.nio.file.Path;
import java.util.ArrayList;
import java.util.List;
import java.util.Optional;
import org.junit.jupiter.api.Test;
import org.junit.jupiter.api.io.TempDir;
import org.rungtone.ladder.LadderSpec;
import org.rungtone.ladder.Topology;
import picocli.CommandLine;

class LadderCommandTest {
    @TempDir
    Path dir;

    private record Run(int exit, String out, String err) {
    }

    private Run run(String... args) {
        StringWriter out = new StringWriter();
        StringWriter err = new StringWriter();
        CommandLine cl = Main.newCommandLine();
        cl.setOut(new PrintWriter(out));
        cl.setErr(new PrintWriter(err));
        List<String> all = new ArrayList<>(List.of("ladder", "--out", dir.resolve("out").toString()));
        all.addAll(List.of(args));
        int exit = cl.execute(all.toArray(new String[0]));
        return new Run(exit, out.toString(), err.toString());
    }

    private void assertBadInput(String expectedError, String... args) {
        Run r = run(args);
        assertEquals(1, r.exit(), r.err());
        assertEquals("rungtone: error: " + expectedError + "\n", r.err());
    }

    @Test
    void printsTheAnalysisAndWritesCsvAndPlots() throws IOException {
        Run r = run("--bits", "4", "--resistors", "68k,33k,15k,8.2k", "--pin-names", "PB0,PB1,PB2,PB3");
        assertEquals(0, r.exit(), r.err());
        assertEquals("", r.err());
        assertTrue(r.out().startsWith("Ladder: weighted 4-bit, 5% parts\n"), r.out());
        assertTrue(r.out().contains("  3    PB3      8.2k\n"), r.out());
        assertTrue(r.out().contains("Linearity (IEEE 1658)"));
        assertTrue(r.out().contains("monotonic         yes"));
        List<String> csv = Files.readAllLines(dir.resolve("out/levels.csv"));
        assertEquals(17, csv.size());
        assertEquals("code,bits,volts,ideal_volts,dnl_lsb,inl_lsb,inl_best_fit_lsb", csv.get(0));
        assertTrue(csv.get(9).startsWith("8,1000,2.60"), csv.get(9));
        for (String png : List.of("transfer.png", "dnl.png", "inl.png")) {
            byte[] head = Files.readAllBytes(dir.resolve("out").resolve(png));
            assertArrayEquals(new byte[] {(byte) 0x89, 'P', 'N', 'G'}, java.util.Arrays.copyOf(head, 4), png);
        }
        assertFalse(Files.exists(dir.resolve("out/monte-carlo.png")));
    }

    @Test
    void jsonWithMonteCarloAndDesignIsReproducible() {
        String[] args = {"--topology", "r2r", "--bits", "6", "--base-r", "4k7", "--tolerance", "1%",
            "--monte-carlo", "300", "--seed", "5", "--design", "--series", "E24", "--json", "--pin-limit", "0.1mA"};
        Run a = run(args);
        Run b = run(args);
        assertEquals(0, a.exit(), a.err());
        assertEquals(a.out(), b.out());
        JsonObject json = JsonParser.parseString(a.out()).getAsJsonObject();
        assertEquals(64, json.getAsJsonArray("levels_v").size());
        assertEquals(300, json.getAsJsonObject("monte_carlo").get("boards").getAsInt());
        JsonObject design = json.getAsJsonObject("design");
        assertTrue(design.get("proposal_worst_inl_lsb").getAsDouble()
                <= design.get("nearest_worst_inl_lsb").getAsDouble());
        // 5 V across a 9.4k-ish leg is well above 0.1 mA: every pin is flagged.
        assertTrue(json.getAsJsonArray("warnings").toString().contains("above the 100µA limit"), a.out());
        assertTrue(Files.exists(dir.resolve("out/monte-carlo.png")));
    }

    @Test
    void readsALadderFileWithOptionsOnTop() {
        Run r = run("--ladder", "examples/ladders/sweep-generator-r2r.toml", "--tolerance", "0.1%", "-q");
        assertEquals(0, r.exit(), r.err());
        assertEquals("", r.out());
        Run chime = run("--ladder", "examples/ladders/door-chime-weighted.toml");
        assertEquals(0, chime.exit(), chime.err());
        assertTrue(chime.out().contains("weighted 4-bit"), chime.out());
        Run alarm = run("--ladder", "examples/ladders/freezer-alarm-custom.toml");
        assertEquals(0, alarm.exit(), alarm.err());
        assertTrue(alarm.out().contains("! not monotonic"), alarm.out());
    }

    @Test
    void badInputGivesOneLineAndExitOne() throws IOException {
        assertBadInput("--bits: bit depth must be 1..16, got 17", "--bits", "17");
        // 0 is refused, not taken for "not given" (which would model the default 8 bits)
        assertBadInput("--bits: bit depth must be 1..16, got 0", "--bits", "0");
        assertBadInput("--base-r: must be 0.1 ohm to 1e12 ohm, got 1e+300", "--topology", "r2r", "--base-r",
                "1e300");
        assertBadInput("--resistors: bit 1 needs a positive, finite resistance, got -2k", "--resistors", "1k,-2k");
        assertBadInput("--resistors: expected 4 values for 4 bits, got 2", "--bits", "4", "--resistors", "1k,2k");
        assertBadInput("--base-r: must be a positive, finite resistance, got 0", "--base-r", "0");
        assertBadInput("--out-min: 6V is at or above the highest buffered ladder level (5V); no usable span is left",
                "--out-min", "6V", "--out-max", "9V");
        assertBadInput("--tolerance: write it as a percentage, e.g. 5% or 0.1%, got '5'", "--tolerance", "5");
        assertBadInput("--monte-carlo: need 1..2000000 boards, got 0", "--monte-carlo", "0");
        assertBadInput("--load: '10 apples' is not a resistance (e.g. 4k7, 2.2k, 100, 1M)", "--load", "10 apples");
        Path board = dir.resolve("board.toml");
        Files.writeString(board, "# greenhouse door chime\n\n[ladder]\ntopology = \"weighted\"\nbits = 6\n\n"
                + "resistors = [\"10k\", \"20k\", \"39k\", \"82k\", \"160k\"]\n");
        assertBadInput(board + ":7: ladder.resistors: expected 6 values for 6 bits, got 5", "--ladder",
                board.toString());
        assertBadInput(board + ":7: ladder.resistors: expected 8 values for 8 bits, got 5 (bits from --bits)",
                "--ladder", board.toString(), "--bits", "8");
        Files.writeString(board, "[ladder]\nbits = \n");
        Run r = run("--ladder", board.toString());
        assertEquals(1, r.exit());
        assertTrue(r.err().startsWith("rungtone: error: " + board + ":2: not valid TOML: "), r.err());
        assertEquals(1, r.err().lines().count(), r.err());
    }

    @Test
    void pinResistanceAboveTheLadderIsAWarningNotAnError() {
        Run r = run("--bits", "2", "--resistors", "40,20", "--pin-r-high", "30");
        assertEquals(0, r.exit(), r.err());
        assertTrue(r.out().contains("! pin resistance (30 high, 20 low) is larger than the smallest ladder resistor"),
                r.out());
    }

    @Test
    void helpShowsAWorkedExampleAndTheDatasheetCaution() {
        StringWriter out = new StringWriter();
        CommandLine cl = Main.newCommandLine();
        cl.setOut(new PrintWriter(out));
        assertEquals(0, cl.execute("ladder", "--help"));
        assertTrue(out.toString().contains("rungtone ladder --topology r2r --bits 6"), out.toString());
        assertTrue(out.toString().contains("datasheet is the authority"), out.toString());
    }

    @Test
    void optionsOverrideTheLadderFileWhichReplacesTheProjectTable() throws IOException {
        org.tomlj.TomlTable project = org.tomlj.Toml.parse("[ladder]\ntopology = \"r2r\"\nbits = 10\n")
                .getTable("ladder");
        LadderOptions opts = new LadderOptions();
        opts.tolerance = "0.1%";
        org.rungtone.ladder.LadderTable table = org.rungtone.ladder.LadderTable.of(project, Path.of("project.toml"));
        LadderSpec fromProject = opts.over(table).spec(0);
        assertEquals(Topology.R2R, fromProject.topology());
        assertEquals(10, fromProject.bits());
        assertEquals(0.001, fromProject.tolerance(), 1e-15);
        Path file = dir.resolve("chime.toml");
        Files.writeString(file, "[ladder]\nbits = 4\nlogic_high = \"3.3V\"\n");
        opts.ladderFile = file;
        LadderSpec fromFile = opts.over(table).spec(6);
        assertEquals(Topology.WEIGHTED, fromFile.topology());
        assertEquals(6, fromFile.bits());
        assertEquals(3.3, fromFile.logicHighVolts());
        assertEquals(0.001, fromFile.tolerance(), 1e-15);
    }

    @Test
    void gaussianSpreadIsReported() {
        Run r = run("--bits", "6", "--monte-carlo", "50", "--gaussian-sigma", "1.5%", "--json");
        assertEquals(0, r.exit(), r.err());
        JsonObject mc = JsonParser.parseString(r.out()).getAsJsonObject().getAsJsonObject("monte_carlo");
        JsonObject spread = mc.getAsJsonObject("spread");
        assertEquals("gaussian", spread.get("distribution").getAsString());
        assertEquals(0.015, spread.get("sigma_fraction").getAsDouble(), 1e-12);
        assertEquals("gaussian, sigma 1.5%", spread.get("description").getAsString());
        assertBadInput("--gaussian-sigma: write it as a percentage, e.g. 1.7%", "--monte-carlo", "5",
                "--gaussian-sigma", "0.02");
    }

    @Test
    void optionsGiveNoLadderWhenNothingIsSaid() {
        LadderOptions none = new LadderOptions();
        assertEquals(Optional.empty(), none.specIfGiven(8));
        LadderOptions some = new LadderOptions();
        some.topology = "r2r";
        some.baseR = "4k7";
        LadderSpec spec = some.specIfGiven(6).orElseThrow();
        assertEquals(Topology.R2R, spec.topology());
        assertEquals(6, spec.bits());
        assertEquals(4.7e3, spec.baseROhms(), 1e-9);
    }
}
