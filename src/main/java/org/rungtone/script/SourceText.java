package org.rungtone.script;

import java.io.StringReader;
import java.util.List;
import org.rungtone.script.ast.Pos;
import org.rungtone.script.parser.RungParserConstants;
import org.rungtone.script.parser.RungParserTokenManager;
import org.rungtone.script.parser.SimpleCharStream;
import org.rungtone.script.parser.Token;

/** A script's text and file name: hands out the text the parser reads and builds errors with excerpts. */
final class SourceText {
    private final String fileName;
    private final String text;
    private final List<String> lines;

    SourceText(String text, String fileName) {
        this.fileName = fileName;
        this.text = text.startsWith("\uFEFF") ? text.substring(1) : text;
        this.lines = List.of(this.text.split("\r\n|\r|\n", -1));
    }

    String fileName() {
        return fileName;
    }

    /** The text for the parser: tabs become spaces so that every character is one column. */
    String parserText() {
        return text.replace('\t', ' ');
    }

    /** An error at {@code pos} with the line it points into. */
    ScriptError error(Pos pos, String problem) {
        int line = Math.max(1, Math.min(pos.line(), lines.size()));
        return new ScriptError(fileName, line, Math.max(1, pos.column()), problem, lines.get(line - 1));
    }

    /** The position just after the last token of the script (1:1 for a script without tokens). */
    Pos end() {
        RungParserTokenManager tokens = new RungParserTokenManager(
                new SimpleCharStream(new StringReader(parserText())));
        Token last = null;
        for (Token t = tokens.getNextToken(); t.kind != RungParserConstants.EOF; t = tokens.getNextToken()) {
            last = t;
        }
        return last == null ? new Pos(1, 1) : after(last);
    }

    /** The position just after a token. */
    static Pos after(Token t) {
        return new Pos(t.endLine, t.endColumn + 1);
    }
}
