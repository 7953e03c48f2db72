package org.rungtone.internal;

import static org.junit.jupiter.api.Assertions.assertEquals;

import org.junit.jupiter.api.Test;
import org.tomlj.Toml;
import org.tomlj.TomlArray;

class TomlTextTest {
    @Test
    void entryLineIsTheLineOfTheEntryItself() {
        String text = "a = [  # levels\n  1.0,\n\n  # skipped\n  2.0, 3.0,\n  4.0]\n";
        TomlArray a = Toml.parse(text).getArray("a");
        // tomlj 1.1.1 puts entry 0 on line 1 (after the bracket) and entry 3 on line 5 (after the comma)
        assertEquals(2, TomlText.entryLine(text, a.inputPositionOf(0)));
        assertEquals(5, TomlText.entryLine(text, a.inputPositionOf(1)));
        assertEquals(5, TomlText.entryLine(text, a.inputPositionOf(2)));
        assertEquals(6, TomlText.entryLine(text, a.inputPositionOf(3)));
    }
}
