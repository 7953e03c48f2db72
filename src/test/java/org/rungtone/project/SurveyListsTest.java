package org.rungtone.project;

import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertThrows;

import java.util.List;
import org.junit.jupiter.api.Test;
import org.rungtone.internal.Setting;
import org.rungtone.internal.SettingError;
import org.rungtone.project.SurveyLists.BitList;
import org.rungtone.project.SurveyLists.RateList;

class SurveyListsTest {
    /** The option of a survey setting, as the command line names it. */
    private static String option(Setting s) {
        return "--" + s.key().replace("survey.", "").replace('_', '-');
    }

    private static List<Integer> bits(String text) {
        return BitList.parse(text).expand();
    }

    private static List<Double> rates(String text) {
        return RateList.parse(text).checked();
    }

    @Test
    void bitListsExpandRangesAndSingleDepthsInOrder() {
        assertEquals(List.of(1, 2, 3, 4, 5, 6, 7, 8, 9, 10, 11, 12), bits("1..12"));
        assertEquals(List.of(4, 6, 8), bits("4,6,8"));
        assertEquals(List.of(8, 2, 3, 4), bits("8, 2..4"));
    }

    @Test
    void malformedBitListsAreRefusedAsSuch() {
        assertEquals("'4..x' is not a bit depth or a range like 4..10 (e.g. 1..12 or 4,6,8)",
                assertThrows(IllegalArgumentException.class, () -> bits("4..x")).getMessage());
        assertEquals("the range '8..4' runs backwards; write 4..8",
                assertThrows(IllegalArgumentException.class, () -> bits("8..4")).getMessage());
        assertEquals("'2..3..4' is not a bit depth or a range like 4..10",
                assertThrows(IllegalArgumentException.class, () -> bits("2..3..4")).getMessage());
    }

    @Test
    void bitListErrorsNameTheSetting() {
        SettingError range = assertThrows(SettingError.class, () -> bits("0,4"));
        assertEquals(Setting.SURVEY_BITS, range.setting());
        assertEquals("--bits-list 0,4: bit depth must be 1..16: 0", range.render(SurveyListsTest::option));
        assertEquals("survey.bits_list 0,4: bit depth must be 1..16: 0", range.getMessage());
        SettingError twice = assertThrows(SettingError.class, () -> bits("4..6,6"));
        assertEquals("--bits-list 4..6,6: 6 appears twice; give each depth once",
                twice.render(SurveyListsTest::option));
    }

    @Test
    void rateListsKeepTheirOrderInHertz() {
        assertEquals(List.of(16_000.0, 8_000.0, 11_025.0), rates("16k,8kHz,11.025k"));
    }

    @Test
    void rateListErrorsNameTheSetting() {
        SettingError range = assertThrows(SettingError.class, () -> rates("500k"));
        assertEquals(Setting.SURVEY_RATES, range.setting());
        assertEquals("--rates 500k: a sample rate must be 1 Hz..384 kHz: 500kHz",
                range.render(SurveyListsTest::option));
        SettingError twice = assertThrows(SettingError.class, () -> rates("8k,8000"));
        assertEquals("--rates 8k,8000: 8kHz appears twice; give each rate once", twice.render(SurveyListsTest::option));
        assertThrows(IllegalArgumentException.class, () -> rates("8k,5V"));
    }
}
