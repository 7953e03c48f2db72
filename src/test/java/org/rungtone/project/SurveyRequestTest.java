package org.rungtone.project;

import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertInstanceOf;
import static org.junit.jupiter.api.Assertions.assertThrows;

import java.nio.file.Path;
import java.util.ArrayList;
import java.util.List;
import java.util.Optional;
import java.util.OptionalDouble;
import java.util.OptionalLong;
import org.junit.jupiter.api.Test;
import org.rungtone.analysis.ReconstructionFilter;
import org.rungtone.condition.ResamplerKind;
import org.rungtone.condition.TarsosResampler;
import org.rungtone.internal.InputError;
import org.rungtone.internal.Setting;
import org.rungtone.internal.SettingError;
import org.rungtone.ladder.LevelTable;
import org.rungtone.quantize.Dither;
import org.rungtone.quantize.ErrorFilter;

class SurveyRequestTest {
    private static final SurveyRequest.Cells CELLS = new SurveyRequest.Cells(List.of(4), List.of(8000.0),
            Dither.TPDF, ErrorFilter.NONE, 1);

    private static ConditioningSettings conditions(OptionalDouble gain, double fadeIn, String resampler) {
        return new ConditioningSettings(OptionalDouble.empty(), false, OptionalDouble.of(-50), gain,
                gain.isPresent() ? OptionalDouble.empty() : OptionalDouble.of(-3), fadeIn, 0.05,
                ResamplerKind.parse(resampler));
    }

    private static SurveyRequest withChannel(int channel) {
        return new SurveyRequest(Path.of("a.wav"), channel, CELLS, conditions(OptionalDouble.empty(), 0, "kaiser"),
                b -> LevelTable.ideal(b, 5), new SurveyRequest.Choice(OptionalLong.empty(), Optional.empty(), false),
                ReconstructionFilter.none(), new SurveyRequest.Output(Path.of("out"), false, "9.9"));
    }

    @Test
    void aChannelOutsideZeroToEightNamesTheChannelSetting() {
        assertEquals(8, withChannel(8).channel());
        SettingError e = assertThrows(SettingError.class, () -> withChannel(9));
        assertEquals(Setting.CHANNEL, e.setting());
        assertEquals("sound.channel must be 0 (mix down) or 1..8: 9", e.getMessage());
        assertEquals("--channel must be 0 (mix down) or 1..8: 9", e.render(s -> "--channel"));
    }

    @Test
    void aNegativeBudgetNamesTheBudgetSetting() {
        SettingError e = assertThrows(SettingError.class, () -> new SurveyRequest.Choice(OptionalLong.of(-1),
                Optional.empty(), false));
        assertEquals(Setting.FLASH_BUDGET, e.setting());
        assertEquals("target.flash_budget must not be negative: -1", e.getMessage());
    }

    @Test
    void conditionsDescribeThemselvesInTheReportsWords() {
        assertEquals("DC kept, trim below -50.0 dBFS, normalized to -3.0 dBFS, fades 20/50 ms",
                conditions(OptionalDouble.empty(), 0.02, "kaiser").describe());
        assertEquals("DC kept, trim below -50.0 dBFS, gain -6.0 dB, fades 0/50 ms",
                conditions(OptionalDouble.of(-6), 0, "kaiser").describe());
    }

    @Test
    void conditionsGiveEachRateItsConditioningAndCheckTheResampler() {
        ConditioningSettings c = conditions(OptionalDouble.of(-6), 0.02, "tarsos");
        assertEquals(16_000, c.at(16_000).targetRateHz(), 0);
        assertEquals(-6, c.at(16_000).gainDb().getAsDouble(), 0);
        assertEquals(0.05, c.at(8_000).fadeOutSeconds(), 0);
        assertInstanceOf(TarsosResampler.class, c.resampler().create(8));
        InputError e = assertThrows(InputError.class, () -> conditions(OptionalDouble.empty(), 0, "linear"));
        assertEquals("sound.resampler must be kaiser or tarsos: linear", e.getMessage());
    }

    @Test
    void cellsCopyTheirLists() {
        List<Integer> bits = new ArrayList<>(List.of(4, 6));
        SurveyRequest.Cells cells = new SurveyRequest.Cells(bits, List.of(8000.0), Dither.NONE,
                ErrorFilter.NONE, 0);
        bits.add(8);
        assertEquals(List.of(4, 6), cells.bitDepths());
    }
}
