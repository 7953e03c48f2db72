package org.rungtone.internal;

import java.nio.file.Path;
import java.util.List;
import java.util.function.Function;
import org.tomlj.Toml;
import org.tomlj.TomlParseError;
import org.tomlj.TomlParseResult;
import org.tomlj.TomlPosition;
import org.tomlj.TomlTable;

/**
 * TOML reading shared by the ladder, project and unit-profile files: every way tomlj 1.1.1 fails becomes an
 * {@link InputError} naming the file, and key positions are found for quoted keys too.
 */
public final class TomlText {
    private TomlText() {
    }

    /**
     * Parses {@code text} from {@code file}. The first syntax error, listed or thrown, goes through
     * {@code notToml}, which words it for its reader.
     *
     * @throws InputError for text that is not TOML or that tomlj cannot read
     */
    public static TomlParseResult parse(String text, Path file, Function<TomlParseError, InputError> notToml) {
        TomlParseResult result;
        try {
            result = Toml.parse(text);
        } catch (TomlParseError e) {
            // tomlj throws some errors (a bad escape in a quoted table name) instead of listing them
            throw notToml.apply(e);
        } catch (StackOverflowError e) {
            throw InputError.inFile(file, "arrays or tables are nested too deeply to read; expected a few levels");
        } catch (AssertionError e) {
            // tomlj 1.1.1 checks a malformed \\u escape with an assert; under java -ea it escapes as an Error
            throw InputError.inFile(file, "not valid TOML: a string holds a broken escape (\\u needs 4 hex digits,"
                    + " \\U needs 8)", e);
        }
        if (result.hasErrors()) {
            throw notToml.apply(result.errors().get(0));
        }
        return result;
    }

    /**
     * The line of an array entry whose tomlj position is {@code pos}. tomlj 1.1.1 places an entry just after
     * the bracket or comma before it, which is the line above when entries stand one per line; this skips
     * blanks, line breaks and comments from there to the entry itself.
     */
    public static int entryLine(String text, TomlPosition pos) {
        int line = 1;
        int i = 0;
        while (line < pos.line() && i < text.length()) {
            if (text.charAt(i++) == '\n') {
                line++;
            }
        }
        i += pos.column() - 1;
        boolean comment = false;
        for (; i < text.length(); i++) {
            char c = text.charAt(i);
            if (c == '\n') {
                line++;
                comment = false;
            } else if (c == '#') {
                comment = true;
            } else if (!comment && c != ' ' && c != '\t' && c != '\r') {
                break;
            }
        }
        return line;
    }

    /**
     * The position of a dotted key such as {@code unit.board}. When a part is a quoted key that is not valid
     * dotted-key syntax ({@code "bad key"}), it is looked up as one name, under its table when the first part
     * names one; null when the key is not there.
     */
    public static TomlPosition positionOf(TomlTable table, String key) {
        try {
            return table.inputPositionOf(key);
        } catch (IllegalArgumentException e) {
            int dot = key.indexOf('.');
            if (dot > 0 && table.isTable(key.substring(0, dot))) {
                return table.inputPositionOf(List.of(key.substring(0, dot), key.substring(dot + 1)));
            }
            return table.inputPositionOf(List.of(key));
        }
    }
}
