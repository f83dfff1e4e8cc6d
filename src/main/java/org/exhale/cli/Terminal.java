package org.exhale.cli;

import java.io.FileDescriptor;
import java.io.FileOutputStream;
import java.io.FilterOutputStream;
import java.io.IOException;
import java.io.OutputStream;
import java.io.PrintStream;
import java.nio.charset.StandardCharsets;

/**
 * The terminal side of the command line: what reaches stdout and stderr passes a filter that turns
 * control characters (ANSI and OSC escape sequences, the bell, backspace, C1 controls) into '?', so
 * a case name, key or file name can never recolour the terminal, retitle its window or ring; tab,
 * line feed and carriage return pass. HTML and SVG outputs escape the same text their own way.
 */
final class Terminal {
    private Terminal() {
    }

    /** The text with every control character but tab, line feed and carriage return replaced by '?'. */
    static String clean(String s) {
        if (s == null) {
            return null;
        }
        StringBuilder sb = null;
        for (int i = 0; i < s.length(); i++) {
            char c = s.charAt(i);
            boolean control = (c < 0x20 && c != '\n' && c != '\t' && c != '\r') || (c >= 0x7F && c <= 0x9F);
            if (control && sb == null) {
                sb = new StringBuilder(s.substring(0, i));
            }
            if (sb != null) {
                sb.append(control ? '?' : c);
            }
        }
        return sb == null ? s : sb.toString();
    }

    /** A UTF-8 print stream over {@code out} that passes no control character but tab, line feed and carriage return. */
    static PrintStream cleaning(OutputStream out) {
        return new PrintStream(new Clean(out), false, StandardCharsets.UTF_8);
    }

    static PrintStream stdout() {
        return cleaning(new java.io.BufferedOutputStream(new FileOutputStream(FileDescriptor.out), 1 << 16));
    }

    static PrintStream stderr() {
        return new PrintStream(new Clean(new java.io.BufferedOutputStream(new FileOutputStream(FileDescriptor.err))), true,
                StandardCharsets.UTF_8);
    }

    /** Byte filter over UTF-8: C0 controls and DEL are single bytes; C1 controls are C2 80..C2 9F. */
    static final class Clean extends FilterOutputStream {
        private boolean pendingC2;

        Clean(OutputStream out) {
            super(out);
        }

        @Override
        public void write(int b) throws IOException {
            int v = b & 0xFF;
            if (pendingC2) {
                pendingC2 = false;
                if (v >= 0x80 && v <= 0x9F) {
                    out.write('?');
                    return;
                }
                out.write(0xC2);
            }
            if (v == 0xC2) {
                pendingC2 = true;
                return;
            }
            if ((v < 0x20 && v != '\n' && v != '\t' && v != '\r') || v == 0x7F) {
                out.write('?');
                return;
            }
            out.write(v);
        }

        @Override
        public void write(byte[] b, int off, int len) throws IOException {
            for (int i = off; i < off + len; i++) {
                write(b[i]);
            }
        }

        @Override
        public void close() throws IOException {
            if (pendingC2) {
                pendingC2 = false;
                out.write(0xC2);
            }
            super.close();
        }
    }
}
