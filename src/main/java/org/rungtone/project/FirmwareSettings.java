package org.rungtone.project;

import java.nio.file.Path;
import java.util.Optional;
import java.util.OptionalLong;
import org.rungtone.firmware.FirmwareRequest;
import org.rungtone.firmware.FlashAttribute;
import org.rungtone.internal.Setting;

/**
 * What is emitted around one sound's samples.
 *
 * @param player the player to emit (everything but the sounds), or empty for the sample array alone
 * @param loop loop points of a looped sound
 * @param flashBudgetBytes the most flash the samples may take, when limited
 * @param flashQualifier attribute that keeps a bare sample array in flash
 * @param cOutDir the folder of the C files, when apart from the output folder
 */
public record FirmwareSettings(Optional<FirmwareRequest> player, Optional<LoopSpan> loop, OptionalLong flashBudgetBytes,
        String flashQualifier, Optional<Path> cOutDir) {
    /**
     * Validates the budget and the attribute ({@link FlashAttribute}), which is kept trimmed.
     *
     * @throws org.rungtone.internal.SettingError naming the setting at fault
     */
    public FirmwareSettings {
        flashBudgetBytes.ifPresent(b -> Setting.FLASH_BUDGET.check(b > 0, "must be positive: %d", b));
        flashQualifier = FlashAttribute.check(flashQualifier);
    }
}
