package org.rungtone.script;

import static org.junit.jupiter.api.Assertions.assertTrue;

import java.io.IOException;
import java.nio.file.Files;
import java.nio.file.Path;
import java.util.ArrayList;
import java.util.List;
import org.junit.jupiter.params.ParameterizedTest;
import org.junit.jupiter.params.provider.MethodSource;

/** Every script example in docs/script-language.md parses and renders. */
class DocsExamplesTest {
    static List<String> examples() throws IOException {
        List<String> blocks = new ArrayList<>();
        StringBuilder block = null;
        for (String line : Files.readAllLines(Path.of("docs", "script-language.md"))) {
            if (line.startsWith("```")) {
                if (block != null && block.toString().contains("\nout ")) {
                    blocks.add(block.toString());
                }
                block = block == null ? new StringBuilder("\n") : null;
            } else if (block != null) {
                block.append(line).append('\n');
            }
        }
        return blocks;
    }

    @ParameterizedTest
    @MethodSource("examples")
    void rendersDocumentedExample(String example) {
        boolean declared = example.contains("\nduration ") || example.contains("\nwavetable ");
        String source = declared ? example : "duration 1s\n" + example;
        RungScript script = RungScript.parse(source, "doc.rung");
        assertTrue(script.render(8000, 1).length() > 0);
    }
}
