package org.exhale.cli;

import java.io.InputStream;
import java.util.Properties;

import picocli.CommandLine;

/**
 * Version and build commit from {@code /exhale-version.properties}, which Maven resource filtering
 * writes at build time (the commit from git through the buildnumber plugin, "unknown" outside a
 * git checkout). A build that skipped filtering (some IDEs) shows "dev" and "unknown".
 */
public final class VersionProvider implements CommandLine.IVersionProvider {
    @Override
    public String[] getVersion() throws Exception {
        return new String[]{"exhale " + version() + " (commit " + commit() + ")"};
    }

    /** The project version, "dev" when not known. */
    public static String version() {
        return property("version", "dev");
    }

    /** The commit the build was made from, "unknown" when not known. */
    public static String commit() {
        return property("commit", "unknown");
    }

    private static String property(String key, String fallback) {
        Properties p = new Properties();
        try (InputStream in = VersionProvider.class.getResourceAsStream("/exhale-version.properties")) {
            if (in != null) {
                p.load(in);
            }
        } catch (java.io.IOException e) {
            return fallback;
        }
        String v = p.getProperty(key, "").trim();
        return v.isEmpty() || v.contains("${") ? fallback : v;
    }
}
