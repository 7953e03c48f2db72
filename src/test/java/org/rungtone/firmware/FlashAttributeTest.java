package org.rungtone.firmware;

import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertThrows;

import org.junit.jupiter.api.Test;
import org.junit.jupiter.params.ParameterizedTest;
import org.junit.jupiter.params.provider.CsvSource;
import org.junit.jupiter.params.provider.ValueSource;
import org.rungtone.internal.SettingError;

class FlashAttributeTest {
    @ParameterizedTest
    @ValueSource(strings = {"PROGMEM", "__flash", "const __flash", "__attribute__((section(\".rodata\")))",
        "__attribute__((aligned(4), section(\".flash_samples\"))) PROGMEM", "__attribute__ ((used))", ""})
    void acceptsIdentifiersAndBalancedAttributeGroups(String text) {
        assertEquals(text, FlashAttribute.check(text));
    }

    @ParameterizedTest
    @CsvSource(delimiter = '|', value = {
        "PROGMEM; int evil = 1; /*|';' at column 8 is not allowed",
        "PROGMEM */ int x|'*' at column 9 is not allowed",
        "{|'{' at column 1 is not allowed",
        "__attribute__((section(\".x\"))|the '(' at column 14 is never closed",
        "section(\".x)|the string at column 9 is never closed",
        "section(\"a*/b\")|'*' at column 11 is not allowed",
        "PROGMEM)|')' at column 8 is not allowed",
        "4k|'4' at column 1 is not allowed"})
    void refusesAnythingThatCouldEndTheDeclaration(String text, String why) {
        SettingError e = assertThrows(SettingError.class, () -> FlashAttribute.check(text));
        assertEquals("target.flash_attr '" + text + "' is not a C attribute: " + why + "; write identifiers and"
                + " __attribute__((...)), e.g. PROGMEM or __attribute__((section(\".rodata\")))", e.getMessage());
    }

    @Test
    void aLineBreakIsRefusedAndShownEscaped() {
        assertEquals("target.flash_attr 'PROGMEM\\nint x;' is not a C attribute: '\\n' at column 8 is not allowed;"
                + " write identifiers and __attribute__((...)), e.g. PROGMEM or __attribute__((section(\".rodata\")))",
                assertThrows(SettingError.class, () -> FlashAttribute.check("PROGMEM\nint x;")).getMessage());
        // blanks around the attribute, a trailing line break included, are trimmed
        assertEquals("PROGMEM", FlashAttribute.check(" PROGMEM\r\n"));
    }
}
