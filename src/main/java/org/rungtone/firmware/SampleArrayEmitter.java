package org.rungtone.firmware;

import java.nio.file.Path;
import java.util.ArrayList;
import java.util.LinkedHashMap;
import java.util.List;
import java.util.Locale;
import java.util.Map;
import org.rungtone.internal.AtomicFiles;
import org.rungtone.quantize.Codes;

/**
 * Emits one sound's codes as a C99 header and source: the sample array ({@code uint8_t} for N &lt;= 8, else
 * {@code uint16_t}), 16 values a line in fixed-width hex, with macros for length, rate and bit depth and a
 * header comment that records the tool version, the source and every setting.
 */
public final class SampleArrayEmitter {
    private static final int PER_LINE = 16;

    private final Templates templates;

    /** An emitter rendering from the given templates. */
    public SampleArrayEmitter(Templates templates) {
        this.templates = templates;
    }

    /**
     * What to emit.
     *
     * @param symbol C symbol prefix from {@link CNames#symbol}
     * @param codes the codes
     * @param flashQualifier text placed after {@code const} in the array definition to keep it in flash
     *     (empty for none; e.g. {@code PROGMEM} on AVR)
     * @param toolVersion Rungtone version for the header comment
     * @param settings ordered "key: value" lines for the header comment
     */
    public record Request(String symbol, Codes codes, String flashQualifier, String toolVersion,
            List<String> settings) {
        /** Copies the settings list. */
        public Request {
            settings = List.copyOf(settings);
        }
    }

    /**
     * Renders and writes {@code SYMBOL.h} and {@code SYMBOL.c} into {@code outDir}.
     *
     * @return the files written, header first
     */
    public List<Path> emit(Request request, Path outDir) {
        Map<String, Object> ctx = context(request);
        // Both templates render before either file is written; the sample array then goes straight to its
        // file, so millions of samples are never one string.
        Templates.Output header = templates.prepare("generic", "samples.h.mustache", ctx);
        Templates.Output source = templates.prepare("generic", "samples.c.mustache", ctx);
        Path h = outDir.resolve(request.symbol() + ".h");
        Path c = outDir.resolve(request.symbol() + ".c");
        AtomicFiles.write(h, header::writeTo);
        AtomicFiles.write(c, source::writeTo);
        return List.of(h, c);
    }

    /** The template context: every value the templates may show, already formatted. */
    Map<String, Object> context(Request r) {
        Codes codes = r.codes();
        int bits = codes.bits();
        Map<String, Object> ctx = new LinkedHashMap<>();
        ctx.put("symbol", r.symbol());
        ctx.put("macro", CNames.macro(r.symbol()));
        ctx.put("guard", CNames.macro(r.symbol()) + "_H");
        ctx.put("toolVersion", r.toolVersion());
        ctx.put("ctype", bits <= 8 ? "uint8_t" : "uint16_t");
        ctx.put("bits", bits);
        ctx.put("length", codes.length());
        ctx.put("rateHz", Math.round(codes.sampleRateHz()));
        ctx.put("maxCode", CLiterals.hex((1L << bits) - 1, CLiterals.hexDigits(bits)));
        ctx.put("midCode", CLiterals.hex(1L << (bits - 1), CLiterals.hexDigits(bits)));
        ctx.put("flash", r.flashQualifier().isEmpty() ? "" : " " + r.flashQualifier());
        ctx.put("bytes", (long) codes.length() * (bits <= 8 ? 1 : 2));
        List<String> settings = new ArrayList<>();
        for (String s : r.settings()) {
            settings.add(s.replace("*/", "* /"));
        }
        ctx.put("settings", settings);
        ctx.put("data", (Templates.Streamed) out -> CLiterals.writeArrayBody(codes.unsafeCodes(),
                CLiterals.hexDigits(bits), PER_LINE, "    ", out));
        ctx.put("durationMs", String.format(Locale.ROOT, "%.1f", 1000.0 * codes.length()
                / codes.sampleRateHz()));
        return ctx;
    }
}
