package org.exhale.cli;

import java.io.InputStream;
import java.util.Properties;

import picocli.CommandLine;

/** Version and build commit from the resource written at build time. */
public final class VersionProvider implements CommandLine.IVersionProvider {
    @Override
    public String[] getVersion() throws Exception {
        Properties p = new Properties();
        try (InputStream in = VersionProvider.class.getResourceAsStream("/exhale-version.properties")) {
            if (in != null) {
                p.load(in);
            }
        }
        return new String[]{"exhale " + p.getProperty("version", "dev") + " (commit " + p.getProperty("commit", "unknown") + ")"};
    }
}
