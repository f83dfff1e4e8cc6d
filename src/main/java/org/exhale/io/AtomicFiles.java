package org.exhale.io;

import java.io.IOException;
import java.nio.charset.StandardCharsets;
import java.nio.file.AtomicMoveNotSupportedException;
import java.nio.file.FileAlreadyExistsException;
import java.nio.file.Files;
import java.nio.file.Path;
import java.nio.file.StandardCopyOption;

/**
 * Writes a file through a temporary file in the same folder, then moves it into place, so a reader
 * never sees half a file. Without {@code replace} the file is put in place by a hard link, which
 * fails if the name exists: of two writers exactly one wins and an existing file is never replaced.
 */
public final class AtomicFiles {
    private AtomicFiles() {
    }

    /** Writes (replacing an existing file). */
    public static void writeString(Path target, String content) {
        write(target, content.getBytes(StandardCharsets.UTF_8), true);
    }

    public static void write(Path target, byte[] content, boolean replace) {
        stage(target, content).commit(replace);
    }

    /** Writes the content to a temporary file beside the target; {@link Staged#commit} puts it in place. */
    public static Staged stage(Path target, byte[] content) {
        Path dir = target.toAbsolutePath().getParent();
        Path tmp = null;
        try {
            if (Files.isDirectory(target)) {
                throw new InputException(ErrorKind.OUTPUT, target.toString(), "", 0, "is a folder; expected a file name");
            }
            Files.createDirectories(dir);
            tmp = Files.createTempFile(dir, "." + target.getFileName() + ".", ".tmp");
            Files.write(tmp, content);
            try {
                // createTempFile makes owner-only files; outputs are meant to be shared like any other file.
                Files.setPosixFilePermissions(tmp, java.nio.file.attribute.PosixFilePermissions.fromString("rw-r--r--"));
            } catch (UnsupportedOperationException notPosix) {
                // keep the platform default
            }
            return new Staged(target, tmp);
        } catch (IOException e) {
            delete(tmp);
            throw new InputException(ErrorKind.OUTPUT, target.toString(), "", 0,
                    "cannot write (" + Messages.of(e) + "); expected a writable folder", e);
        }
    }

    private static void delete(Path p) {
        if (p != null) {
            try {
                Files.deleteIfExists(p);
            } catch (IOException ignored) {
                // the original error is the one worth reporting
            }
        }
    }

    /** A file written aside, not yet in place. */
    public static final class Staged {
        private final Path target;
        private final Path tmp;

        private Staged(Path target, Path tmp) {
            this.target = target;
            this.tmp = tmp;
        }

        /** Puts the file in place; without {@code replace} an existing file is refused and kept. */
        public void commit(boolean replace) {
            try {
                if (replace) {
                    try {
                        Files.move(tmp, target, StandardCopyOption.ATOMIC_MOVE, StandardCopyOption.REPLACE_EXISTING);
                    } catch (AtomicMoveNotSupportedException e) {
                        Files.move(tmp, target, StandardCopyOption.REPLACE_EXISTING);
                    }
                } else {
                    try {
                        Files.createLink(target, tmp);
                    } catch (FileAlreadyExistsException e) {
                        throw e;
                    } catch (IOException | UnsupportedOperationException e) {
                        // no hard links here: a move that refuses an existing name (not atomic, but never replacing)
                        Files.move(tmp, target);
                    }
                }
            } catch (FileAlreadyExistsException e) {
                throw new InputException(ErrorKind.OUTPUT, target.toString(), "", 0,
                        "exists (perhaps written by another run just now); use --force to replace it", e);
            } catch (IOException e) {
                throw new InputException(ErrorKind.OUTPUT, target.toString(), "", 0,
                        "cannot write (" + Messages.of(e) + "); expected a writable folder", e);
            } finally {
                delete(tmp);
            }
        }

        /** Forgets the staged file. */
        public void discard() {
            delete(tmp);
        }
    }
}
