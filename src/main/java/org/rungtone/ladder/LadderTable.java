package org.rungtone.ladder;

import java.nio.file.Path;
import org.rungtone.internal.InputError;
import org.tomlj.TomlTable;

/**
 * A {@code [ladder]} table as a user wrote it, in a ladder file or a project file, with the file it came from;
 * keeps the TOML library's types inside the readers.
 */
public final class LadderTable {
    private final TomlTable table;
    private final Path file;

    private LadderTable(TomlTable table, Path file) {
        this.table = table;
        this.file = file;
    }

    /** The table read by a file reader that already parsed {@code file}. */
    public static LadderTable of(TomlTable table, Path file) {
        return new LadderTable(table, file);
    }

    /**
     * The {@code [ladder]} table of a ladder file.
     *
     * @throws InputError when the file cannot be read, is not TOML or has no {@code [ladder]} table
     */
    public static LadderTable read(Path file) {
        return new LadderTable(LadderFile.readTable(file), file);
    }

    /** The file it came from. */
    public Path file() {
        return file;
    }

    /** True when the table itself fixes a bit depth (bits, or a per-bit resistor list). */
    public boolean statesBits() {
        return table.contains("bits") || table.contains("resistors");
    }

    /**
     * A builder holding the table's values.
     *
     * @throws InputError naming the file, line and key of a malformed value
     */
    public LadderSpec.Builder builder() {
        return LadderFile.read(table, file);
    }

    /** "FILE:LINE: ladder.KEY" for a key of this table. */
    public String where(String key) {
        return LadderFile.where(table, file, key);
    }

    /** The ladder the table describes, defaults filling the rest. */
    public LadderSpec spec() {
        return LadderSpec.fromToml(table, file);
    }
}
