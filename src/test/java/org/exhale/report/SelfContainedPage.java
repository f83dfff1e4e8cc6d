package org.exhale.report;

import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertFalse;

import java.io.IOException;
import java.nio.file.Files;
import java.nio.file.Path;
import java.util.Locale;
import java.util.regex.Matcher;
import java.util.regex.Pattern;

/** The checks every report page must pass: it opens offline and runs nothing. */
final class SelfContainedPage {
    static final String SVG_NS = "http://www.w3.org/2000/svg";

    private SelfContainedPage() {
    }

    static void check(Path dir) throws IOException {
        String html = Files.readString(dir.resolve("report.html"));
        String lower = html.toLowerCase(Locale.ROOT);
        assertFalse(lower.contains("<script"), dir + ": script");
        Matcher m = Pattern.compile("(?i)https?://[^\"'\\s<>)]*").matcher(html);
        while (m.find()) {
            assertEquals(SVG_NS, m.group(), dir + ": address in the page");
        }
        assertFalse(html.contains("@import") || html.contains("@font-face"), dir + ": outside style or font");
        assertFalse(Pattern.compile("url\\((?!#)").matcher(html).find(), dir + ": url() only to ids in the page");
        assertFalse(Pattern.compile("(?i)(href|src)=['\"](?!#|charts/)").matcher(html).find(),
                dir + ": links only to the chart files beside the page");
        assertFalse(lower.contains("<link"), dir + ": linked file");
        assertFalse(lower.matches("(?s).*\\son[a-z]+=.*"), dir + ": event handler attribute");
    }
}
