package org.rungtone.calibrate;

import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertThrows;

import java.util.List;
import java.util.SortedSet;
import java.util.TreeSet;
import org.junit.jupiter.api.Test;
import org.junit.jupiter.params.ParameterizedTest;
import org.junit.jupiter.params.provider.CsvSource;
import org.rungtone.internal.InputError;

/** Reading filled-in measurement files: layouts, units, comments, repeats and one-line errors. */
class MeasurementCsvTest {
    private static Measurements parse(String text, int bits) {
        return MeasurementCsv.parse(text, "m.csv", bits);
    }

    private static String error(String text, int bits) {
        return assertThrows(InputError.class, () -> parse(text, bits)).getMessage();
    }

    @ParameterizedTest(name = "{0}")
    @CsvSource(delimiter = '|', value = {
        "2.613|2.613|0.001",
        "2.613 V|2.613|0.001",
        "2.613V|2.613|0.001",
        "2.61 v|2.61|0.01",
        "612mV|0.612|0.001",
        "612.5 mV|0.6125|0.0001",
        "850uV|0.00085|0.000001",
        "850 µV|0.00085|0.000001",
        "-0.003 V|-0.003|0.001",
        ".5|0.5|0.1",
        "5|5|1",
        "2.5e-1|0.25|0.01"})
    void readsVoltsWithUnitsAndTheirResolution(String text, double volts, double step) {
        Measurements m = parse("3, " + text + "\n", 4);
        Reading r = m.readings().get(0);
        assertEquals(3, r.code());
        assertEquals(volts, r.volts(), 1e-12);
        assertEquals(step, r.stepVolts(), step * 1e-9);
    }

    @Test
    void readsThePlanLayoutWithCommentsBlankLinesAndRepeats() {
        String text = "\uFEFF# Rungtone measurement plan\n"
                + "code,binary,expected_volts,measured\n"
                + "\n"
                + "0,000,0.0000,0.002\n"
                + "# the meter drifted here\n"
                + "1,001,0.6250,0.627 V   # first try\n"
                + "0b001,001,0.6250,629mV\n"
                + "0x2,010,1.2500,\n"
                + "4,100,2.5000,2.493\n"
                + "   \n";
        Measurements m = parse(text, 3);
        assertEquals(4, m.readings().size());
        assertEquals(List.of(4, 6, 7, 9), m.readings().stream().map(Reading::line).toList());
        CodeMean one = m.means().get(1);
        assertEquals(1, one.code());
        assertEquals(2, one.count());
        assertEquals(0.628, one.meanVolts(), 1e-12);
        assertEquals(Math.sqrt(2e-6), one.stdVolts(), 1e-12);
        assertEquals(new TreeSet<>(List.of(2)), m.unmeasured());
        assertEquals(Math.sqrt(2e-6), m.repeatSpreadVolts(), 1e-12);
        assertEquals(0.001, m.resolutionVolts(), 1e-15);
    }

    @Test
    void takesTheBitDepthFromTheBinaryColumn() {
        Measurements m = parse("code,binary,measured\n5,000101,0.39\n", 0);
        assertEquals(6, m.bits());
    }

    @Test
    void aCodeListedWithoutAReadingIsNotMeasuredUnlessReadElsewhere() {
        SortedSet<Integer> un = parse("code,measured\n5,\n5,1.2\n6,\n", 3).unmeasured();
        assertEquals(new TreeSet<>(List.of(6)), un);
    }

    @Test
    void namesTheLineOfEachBadRow() {
        assertEquals("m.csv:3: 3 fields where 2 are expected (code, volts); a decimal comma splits a number in"
                + " two: write 2.613, not 2,613", error("# readings\n1, 0.31\n2, 2,61\n", 4));
        assertEquals("m.csv:2: '2,61' is not a reading in volts; write 2.613, 2.613 V or 612mV; use '.' as the"
                + " decimal point: 2.61", error("code,measured\n2,\"2,61\"\n", 4));
        assertEquals("m.csv:2: 'two' is not a code; write it in decimal (37), binary (0b100101) or hex (0x25)",
                error("code,volts\ntwo,1.0\n", 4));
        assertEquals("m.csv:4: code 16 is outside 0..15 for a 4-bit ladder", error("0,0\n\n# x\n16,1.0\n", 4));
        assertEquals("m.csv:2: binary 0110 is code 6 but the code column says 5; correct one of them",
                error("code,binary,measured\n5,0110,1.0\n", 4));
        assertEquals("m.csv:1: '2613' is not a plausible reading (more than 1000 V); is a decimal point missing?"
                + " write 2.613 or 2613mV", error("3,2613\n", 4));
        assertEquals("m.csv:1: '2.6 kV' is not a reading in volts; write 2.613, 2.613 V or 612mV",
                error("3,2.6 kV\n", 4));
        assertEquals("m.csv:2: a reading without a code; put the code in the 1. column", error("1,1\n,2.0\n", 4));
        assertEquals("m.csv:1: the first line is neither a reading nor a header with a 'code' and a 'measured'"
                + " (or 'volts') column; separate the fields with commas", error("code;measured\n1;2\n", 4));
        assertEquals("m.csv: no readings found; write one per line: code, volts (e.g. 37, 2.613)",
                error("# nothing yet\n\n", 4));
        assertEquals("m.csv: the bit depth is unknown; give --bits or --ladder (the file has no binary column to"
                + " tell it)", error("1,0.5\n", 0));
    }

    @Test
    void quotesTheDecimalCommaFixLikeTheReadingItself() {
        // The suggested fix is shown as the field is: control characters as '?', at most 40 characters.
        String field = "2,61\u0000" + "x".repeat(50);
        String shownFix = "2.61?" + "x".repeat(35) + "...";
        assertEquals("m.csv:2: '2,61?" + "x".repeat(35) + "...' is not a reading in volts; write 2.613, 2.613 V or"
                + " 612mV; use '.' as the decimal point: " + shownFix,
                error("code,measured\n2,\"" + field + "\"\n", 4));
    }
}
