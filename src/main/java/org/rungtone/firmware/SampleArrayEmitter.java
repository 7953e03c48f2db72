package org.rungtone.firmware;

import java.nio.file.Path;
import java.util.List;
import org.rungtone.internal.AtomicFiles;
import org.rungtone.quantize.Codes;

/**
 * Emits one sound's codes as a C99 header and source: the sample array ({@code uint8_t} for N &lt;= 8, else
 * {@code uint16_t}), 16 values a line in fixed-width hex, with macros for length, rate and bit depth and a
 * header comment that records the tool version, the source and every setting.
 */
public final class SampleArrayEmitter {
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
        /**
         * Copies the settings list and checks the attribute ({@link FlashAttribute}).
         *
         * @throws org.rungtone.internal.SettingError when the attribute is not one
         */
        public Request {
            settings = List.copyOf(settings);
            flashQualifier = FlashAttribute.check(flashQualifier);
        }
    }

    /**
     * Renders and writes {@code SYMBOL.h} and {@code SYMBOL.c} into {@code outDir}.
     *
     * @return the files written, header first
     */
    public List<Path> emit(Request request, Path outDir) {
        SampleArrayView view = SampleArrayView.of(request);
        List<Templates.Stream> streams = List.of(view.array().data());
        // Both templates render before either file is written; the sample array then goes straight to its
        // file, so millions of samples are never one string.
        Templates.Output header = templates.prepare("generic", "samples.h.mustache", view, streams);
        Templates.Output source = templates.prepare("generic", "samples.c.mustache", view, streams);
        Path h = outDir.resolve(request.symbol() + ".h");
        Path c = outDir.resolve(request.symbol() + ".c");
        AtomicFiles.write(h, header::writeTo);
        AtomicFiles.write(c, source::writeTo);
        return List.of(h, c);
    }
}
