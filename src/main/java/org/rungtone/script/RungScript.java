package org.rungtone.script;

import java.io.IOException;
import java.io.StringReader;
import java.nio.ByteBuffer;
import java.nio.charset.CharacterCodingException;
import java.nio.charset.CodingErrorAction;
import java.nio.charset.StandardCharsets;
import java.nio.file.AccessDeniedException;
import java.nio.file.Files;
import java.nio.file.NoSuchFileException;
import java.nio.file.Path;
import java.util.OptionalDouble;
import org.rungtone.internal.Checks;
import org.rungtone.internal.InputError;
import org.rungtone.script.ast.Pos;
import org.rungtone.script.ast.SExpression;
import org.rungtone.script.ast.Script;
import org.rungtone.script.ast.ScriptProblem;
import org.rungtone.script.ast.Stmt;
import org.rungtone.script.eval.Header;
import org.rungtone.script.eval.Program;
import org.rungtone.script.parser.ParseException;
import org.rungtone.script.parser.RungParser;
import org.rungtone.script.parser.TokenMgrError;
import org.rungtone.source.Signal;

/**
 * A parsed and checked {@code .rung} waveform script (see docs/script-language.md): a clip with a duration or
 * a single-cycle wavetable, rendered to a {@link Signal} at any sample rate.
 *
 * <p>{@link #parse} finds every problem that does not depend on the sample rate; {@link #render} compiles the
 * script into block evaluators for the rate and seed and runs them. All problems are {@link ScriptError}s.
 */
public final class RungScript {
    /** What a script declares. */
    public enum Kind { CLIP, WAVETABLE }

    /** Sample rate used when neither the caller nor the script chooses one. */
    public static final double DEFAULT_RATE_HZ = 16000;
    /** Longest clip rendered, in samples. */
    public static final long MAX_SAMPLES = 100_000_000L;

    private final Script tree;
    private final Header header;
    private final SourceText source;

    private RungScript(Script tree, Header header, SourceText source) {
        this.tree = tree;
        this.header = header;
        this.source = source;
    }

    /**
     * Parses and checks a script.
     *
     * @param fileName the name used in error messages
     * @throws ScriptError for any problem, with its position
     */
    public static RungScript parse(String source, String fileName) {
        SourceText text = new SourceText(source, fileName);
        RungParser parser = new RungParser(new StringReader(text.parserText()));
        try {
            Script parsed = read(parser, text);
            Script tree = new Script(parsed.statements(), text.end());
            Header header = Program.check(tree);
            double rate = header.rateHz().orElse(DEFAULT_RATE_HZ);
            Program.compile(tree, header, rate, 0);
            return new RungScript(tree, header, text);
        } catch (ParseException e) {
            parser.getToken(2);
            throw SyntaxErrors.of(e, text);
        } catch (ScriptProblem p) {
            throw text.error(p.pos(), p.getMessage());
        } catch (TokenMgrError e) {
            throw text.error(new Pos(1, 1), "unreadable script text; expected plain UTF-8 text");
        }
    }

    /**
     * Runs the parser. Its grammar recurses once per parenthesis or prefix operator, so text nested some
     * hundreds deep can exhaust the stack before the depth checks on the tree ever run; that is reported at
     * the token the parser had reached.
     */
    private static Script read(RungParser parser, SourceText text) throws ParseException {
        try {
            return parser.Script();
        } catch (StackOverflowError e) {
            Pos at = parser.token == null ? new Pos(1, 1) : new Pos(parser.token.beginLine,
                    parser.token.beginColumn);
            throw text.error(at, "the expression is nested too deeply here to be read; expected fewer"
                    + " parentheses or operators inside one another");
        }
    }

    /**
     * Reads and parses a UTF-8 script file.
     *
     * @throws InputError naming the file when it cannot be read
     * @throws ScriptError for problems in the script
     */
    public static RungScript load(Path file) {
        byte[] bytes;
        try {
            bytes = Files.readAllBytes(file);
        } catch (NoSuchFileException e) {
            throw InputError.inFile(file, "no such file; expected a .rung script", e);
        } catch (AccessDeniedException e) {
            throw InputError.inFile(file, "permission denied; expected a readable .rung script", e);
        } catch (IOException e) {
            String why = Files.isDirectory(file) ? "is a folder; expected a .rung script" : "cannot be read: "
                    + e.getMessage();
            throw InputError.inFile(file, why, e);
        }
        String text;
        try {
            text = StandardCharsets.UTF_8.newDecoder()
                    .onMalformedInput(CodingErrorAction.REPORT)
                    .onUnmappableCharacter(CodingErrorAction.REPORT)
                    .decode(ByteBuffer.wrap(bytes)).toString();
        } catch (CharacterCodingException e) {
            throw InputError.inFile(file, "is not UTF-8 text; expected a .rung script saved as UTF-8", e);
        }
        return parse(text, file.toString());
    }

    /** Whether the script is a clip or a wavetable. */
    public Kind kind() {
        return header.wavetable() ? Kind.WAVETABLE : Kind.CLIP;
    }

    /** The sample rate the script asks for with a {@code rate} line, if any. */
    public OptionalDouble declaredRateHz() {
        return header.rateHz();
    }

    /** A clip's declared duration in seconds; NaN for a wavetable. */
    public double durationSeconds() {
        return header.durationSeconds();
    }

    /** A wavetable's samples per cycle; 0 for a clip. */
    public int tableLength() {
        return header.tableLength();
    }

    /**
     * Renders the script. A clip gives round(duration · rate) samples at {@code rateHz}; a wavetable gives
     * {@link #tableLength()} samples of one cycle (phase 0 to 1), labelled with {@code rateHz}, or with the
     * table length (one cycle per second) when neither the caller nor the script sets a rate.
     *
     * @param rateHz the sample rate; NaN for the script's {@code rate} line, else 16 kHz for a clip
     * @param seed seed of every noise source; the same seed gives the same samples
     * @throws ScriptError when evaluation produces NaN or infinity (with position and time), or the clip is
     *     too long
     * @throws InputError when {@code rateHz} is not positive
     */
    public Signal render(double rateHz, long seed) {
        double fallback = kind() == Kind.CLIP ? DEFAULT_RATE_HZ : header.tableLength();
        double rate = Double.isNaN(rateHz) ? header.rateHz().orElse(fallback) : rateHz;
        Checks.checkInput(rate > 0 && rate < Double.POSITIVE_INFINITY,
                "%s: the sample rate must be a positive number of hertz: %s", source.fileName(), rate);
        int samples = kind() == Kind.WAVETABLE ? header.tableLength() : clipSamples(rate);
        try {
            Program program = Program.compile(tree, header, rate, seed);
            return Signal.wrap(program.render(samples), rate);
        } catch (ScriptProblem p) {
            throw source.error(p.pos(), p.getMessage());
        }
    }

    private int clipSamples(double rate) {
        double count = Math.rint(header.durationSeconds() * rate);
        if (count < 1 || count > MAX_SAMPLES) {
            Pos at = new Pos(1, 1);
            for (Stmt s : tree.statements()) {
                if (s instanceof Stmt.Duration) {
                    at = s.pos();
                }
            }
            String hz = SExpression.number(rate) + " Hz";
            throw source.error(at, count < 1
                    ? "the clip is shorter than one sample at " + hz + "; expected a longer duration"
                    : "the clip is more than " + MAX_SAMPLES + " samples long at " + hz
                            + "; expected a shorter duration or a lower rate");
        }
        return (int) count;
    }

    /** The syntax tree as an s-expression, e.g. {@code (script (duration 1) (out (sine 440)))}. */
    public String toSExpression() {
        return SExpression.of(tree);
    }
}
