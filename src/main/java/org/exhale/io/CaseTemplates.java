package org.exhale.io;

import java.io.IOException;
import java.io.InputStream;
import java.io.UncheckedIOException;
import java.nio.charset.StandardCharsets;
import java.util.Locale;

/**
 * The commented case files that {@code exhale new} writes, kept as resources under
 * {@code /templates/}. Each is an invented demo scenario, complete (every key with its unit and a
 * one-line meaning) and valid as written.
 */
public final class CaseTemplates {
    /** The plan-view shapes a template exists for. */
    public enum Kind {
        line, disc, rectangle;

        /** The name of the template resource for this shape and cap. */
        public String resource(boolean dense) {
            return "/templates/" + name() + (dense ? "-dense" : "") + ".yaml";
        }

        /** The file name suggested when none is given. */
        public String fileName(boolean dense) {
            return name() + (dense ? "-dense" : "") + ".yaml";
        }

        public static Kind of(String text) {
            return valueOf(text.trim().toLowerCase(Locale.ROOT));
        }
    }

    private CaseTemplates() {
    }

    /** The template's text (UTF-8). */
    public static String text(Kind kind, boolean dense) {
        String name = kind.resource(dense);
        try (InputStream in = CaseTemplates.class.getResourceAsStream(name)) {
            if (in == null) {
                throw new IllegalStateException("template " + name + " is missing from the build");
            }
            return new String(in.readAllBytes(), StandardCharsets.UTF_8);
        } catch (IOException e) {
            throw new UncheckedIOException(e);
        }
    }
}
