package org.rungtone.cli;

import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertThrows;

import java.util.List;
import org.junit.jupiter.api.Test;
import org.rungtone.cli.SurveyLists.BitList;
import org.rungtone.cli.SurveyLists.RateList;
import org.rungtone.internal.Setting;
import org.rungtone.internal.SettingError;
import picocli.CommandLine.TypeConversionException;

class SurveyListsTest {
    private static List<Integer> bits(String text) {
        return new BitList.Parser().convert(text).expand();
    }

    private static List<Double> rates(String text) {
        return new RateList.Parser().convert(text).checked();
    }

    @Test
    void bitListsExpandRangesAndSingleDepthsInOrder() {
        assertEquals(List.of(1, 2, 3, 4, 5, 6, 7, 8, 9, 10, 11, 12), bits("1..12"));
        assertEquals(List.of(4, 6, 8), bits("4,6,8"));
        assertEquals(List.of(8, 2, 3, 4), bits("8, 2..4"));
    }

    @Test
    void malformedBitListsAreUsageErrors() {
        assertEquals("'4..x' is not a bit depth or a range like 4..10 (e.g. --bits-list 1..12 or 4,6,8)",
                assertThrows(TypeConversionException.class, () -> bits("4..x")).getMessage());
        assertEquals("the range '8..4' runs backwards; write 4..8",
                assertThrows(TypeConversionException.class, () -> bits("8..4")).getMessage());
        assertEquals("'2..3..4' is not a bit depth or a range like 4..10",
                assertThrows(TypeConversionException.class, () -> bits("2..3..4")).getMessage());
    }

    @Test
    void bitListErrorsNameTheSetting() {
        SettingError range = assertThrows(SettingError.class, () -> bits("0,4"));
        assertEquals(Setting.SURVEY_BITS, range.setting());
        assertEquals("--bits-list 0,4: bit depth must be 1..16: 0", range.render(OptionNames::of));
        assertEquals("survey.bits_list 0,4: bit depth must be 1..16: 0", range.getMessage());
        SettingError twice = assertThrows(SettingError.class, () -> bits("4..6,6"));
        assertEquals("--bits-list 4..6,6: 6 appears twice; give each depth once", twice.render(OptionNames::of));
    }

    @Test
    void rateListsKeepTheirOrderInHertz() {
        assertEquals(List.of(16_000.0, 8_000.0, 11_025.0), rates("16k,8kHz,11.025k"));
    }

    @Test
    void rateListErrorsNameTheSetting() {
        SettingError range = assertThrows(SettingError.class, () -> rates("500k"));
        assertEquals(Setting.SURVEY_RATES, range.setting());
        assertEquals("--rates 500k: a sample rate must be 1 Hz..384 kHz: 500kHz", range.render(OptionNames::of));
        SettingError twice = assertThrows(SettingError.class, () -> rates("8k,8000"));
        assertEquals("--rates 8k,8000: 8kHz appears twice; give each rate once", twice.render(OptionNames::of));
        assertThrows(TypeConversionException.class, () -> rates("8k,5V"));
    }
}
