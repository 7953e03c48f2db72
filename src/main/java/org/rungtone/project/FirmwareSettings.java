package org.rungtone.project;

import java.util.Optional;
import org.rungtone.firmware.FirmwareRequest;
import org.rungtone.firmware.FlashAttribute;
import org.rungtone.internal.Setting;

/**
 * What is emitted around one sound's samples.
 *
 * @param player the player to emit (everything but the sounds), or empty for the sample array alone
 * @param loop loop points of a looped sound
 * @param flashBudgetBytes the most flash the samples may take, 0 for no limit
 * @param flashQualifier attribute that keeps a bare sample array in flash
 */
public record FirmwareSettings(Optional<FirmwareRequest> player, Optional<LoopSpan> loop, long flashBudgetBytes,
        String flashQualifier) {
    /**
     * Validates the budget and the attribute ({@link FlashAttribute}), which is kept trimmed.
     *
     * @throws org.rungtone.internal.SettingError naming the setting at fault
     */
    public FirmwareSettings {
        Setting.FLASH_BUDGET.check(flashBudgetBytes >= 0, "must be positive: %d", flashBudgetBytes);
        flashQualifier = FlashAttribute.check(flashQualifier);
    }
}
