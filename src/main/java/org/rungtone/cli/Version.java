package org.rungtone.cli;

import java.io.IOException;
import java.io.InputStream;
import java.util.Properties;
import picocli.CommandLine.IVersionProvider;

/** The tool version, read from the filtered resource written by the build. */
public final class Version {
    private static final String VERSION = load();

    private Version() {
    }

    /** The version string, e.g. "0.1.0". */
    public static String get() {
        return VERSION;
    }

    private static String load() {
        try (InputStream in = Version.class.getResourceAsStream("/org/rungtone/version.properties")) {
            if (in == null) {
                return "dev";
            }
            Properties p = new Properties();
            p.load(in);
            return p.getProperty("version", "dev");
        } catch (IOException e) {
            return "dev";
        }
    }

    /** picocli's hook for --version. */
    public static final class Provider implements IVersionProvider {
        @Override
        public String[] getVersion() {
            return new String[] {"rungtone " + VERSION,
                "GPL-3.0-or-later; emitted C carries the MIT licence stated in its header"};
        }
    }
}
