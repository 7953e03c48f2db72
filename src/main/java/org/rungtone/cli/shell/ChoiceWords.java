package org.rungtone.cli.shell;

import java.util.ArrayList;
import java.util.List;
import java.util.Locale;
import org.rungtone.firmware.TimerKind;
import org.rungtone.quantize.ErrorFilter;
import picocli.CommandLine.Model.ArgSpec;

/**
 * The words an option accepts, as its help and the docs spell them: an enum's constants in lower case (the
 * converters take any case), the timers by their option names, the shaping orders, and for options typed as
 * text the words their {@code completionCandidates} list ({@link Choices}). Read only to write completion
 * scripts.
 */
final class ChoiceWords {
    private ChoiceWords() {
    }

    /** The words {@code arg} accepts; empty when it takes free text. */
    static List<String> of(ArgSpec arg) {
        Class<?> type = arg.type();
        if (type == TimerKind.class) {
            List<String> names = new ArrayList<>();
            for (TimerKind k : TimerKind.values()) {
                names.add(k.optionName());
            }
            return names;
        }
        if (type == ErrorFilter.class) {
            // the orders ErrorFilter.parse takes; a filter of given taps has no word
            return List.of("none", "first", "second");
        }
        if (arg.completionCandidates() != null
                && arg.completionCandidates().getClass().getEnclosingClass() == Choices.class) {
            // a narrower list than the type's (survey --storage takes only the Tread stores)
            List<String> words = new ArrayList<>();
            arg.completionCandidates().forEach(words::add);
            return words;
        }
        if (type.isEnum()) {
            List<String> names = new ArrayList<>();
            for (Object constant : type.getEnumConstants()) {
                names.add(((Enum<?>) constant).name().toLowerCase(Locale.ROOT));
            }
            return names;
        }
        List<String> words = new ArrayList<>();
        if (arg.completionCandidates() != null) {
            arg.completionCandidates().forEach(words::add);
        }
        return words;
    }
}
