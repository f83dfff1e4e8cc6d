package org.exhale.io;

import java.io.IOException;
import java.nio.charset.StandardCharsets;
import java.nio.file.AtomicMoveNotSupportedException;
import java.nio.file.Files;
import java.nio.file.Path;
import java.nio.file.StandardCopyOption;

/** Writes a file through a temporary file in the same folder, then moves it into place, so a reader never sees half a file. */
public final class AtomicFiles {
    private AtomicFiles() {
    }

    public static void writeString(Path target, String content) {
        Path dir = target.toAbsolutePath().getParent();
        Path tmp = null;
        try {
            Files.createDirectories(dir);
            tmp = Files.createTempFile(dir, "." + target.getFileName() + ".", ".tmp");
            Files.writeString(tmp, content, StandardCharsets.UTF_8);
            try {
                // createTempFile makes owner-only files; outputs are meant to be shared like any other file.
                Files.setPosixFilePermissions(tmp, java.nio.file.attribute.PosixFilePermissions.fromString("rw-r--r--"));
            } catch (UnsupportedOperationException notPosix) {
                // keep the platform default
            }
            try {
                Files.move(tmp, target, StandardCopyOption.ATOMIC_MOVE, StandardCopyOption.REPLACE_EXISTING);
            } catch (AtomicMoveNotSupportedException e) {
                Files.move(tmp, target, StandardCopyOption.REPLACE_EXISTING);
            }
        } catch (IOException e) {
            if (tmp != null) {
                try {
                    Files.deleteIfExists(tmp);
                } catch (IOException ignored) {
                    // the original error is the one worth reporting
                }
            }
            throw new InputException(ErrorKind.OUTPUT, target.toString(), "", 0,
                    "cannot write (" + e.getMessage() + "); expected a writable folder", e);
        }
    }
}
