package org.exhale.io;

import java.io.IOException;
import java.nio.charset.StandardCharsets;
import java.nio.file.AtomicMoveNotSupportedException;
import java.nio.file.DirectoryStream;
import java.nio.file.Files;
import java.nio.file.Path;
import java.nio.file.StandardCopyOption;
import java.util.LinkedHashMap;
import java.util.Map;

/**
 * Collects a command's output files in memory and writes them all at once: each file goes to a
 * temporary file in the target folder and is then moved into place, so an interrupted run leaves
 * the previous results intact and no reader ever sees a half-written file. An existing folder
 * with files in it is only written into with {@code force}.
 */
public final class OutputFolder {
    private final Path dir;
    private final boolean force;
    private final Map<String, byte[]> files = new LinkedHashMap<>();
    private final java.util.Set<String> owned = new java.util.LinkedHashSet<>();

    public OutputFolder(Path dir, boolean force) {
        this.dir = dir;
        this.force = force;
    }

    public Path dir() {
        return dir;
    }

    /** Fails early (before any computation) if the folder exists, is not empty and force is not set. */
    public void checkWritable() {
        if (Files.exists(dir) && !Files.isDirectory(dir)) {
            throw new InputException(ErrorKind.OUTPUT, dir.toString(), "", 0, "exists and is not a folder");
        }
        if (!force && Files.isDirectory(dir)) {
            try (DirectoryStream<Path> s = Files.newDirectoryStream(dir)) {
                if (s.iterator().hasNext()) {
                    throw new InputException(ErrorKind.OUTPUT, dir.toString(), "", 0,
                            "output folder exists and is not empty; use --force to overwrite its files");
                }
            } catch (IOException e) {
                throw new InputException(ErrorKind.OUTPUT, dir.toString(), "", 0, "cannot read folder: " + e.getMessage());
            }
        }
    }

    /**
     * Names (files or folders) this command writes in some runs: whichever of them this run does not
     * write are removed at commit, so that a reused folder never mixes a new result with an old one
     * (an infeasible plan beside the previous plan's recipe, for instance).
     */
    public OutputFolder owns(String... names) {
        owned.addAll(java.util.List.of(names));
        return this;
    }

    public void put(String name, String content) {
        files.put(name, content.getBytes(StandardCharsets.UTF_8));
    }

    public void put(String name, byte[] content) {
        files.put(name, content.clone());
    }

    /** Removes what lies at {@code rel} unless this run wrote it (folders: their files this run did not write). */
    private void prune(Path p, String rel) throws IOException {
        if (!Files.exists(p, java.nio.file.LinkOption.NOFOLLOW_LINKS) || files.containsKey(rel)) {
            return;
        }
        if (Files.isDirectory(p, java.nio.file.LinkOption.NOFOLLOW_LINKS)) {
            try (java.util.stream.Stream<Path> s = Files.list(p)) {
                for (Path c : (Iterable<Path>) s::iterator) {
                    prune(c, rel + "/" + c.getFileName());
                }
            }
            try (java.util.stream.Stream<Path> s = Files.list(p)) {
                if (s.findAny().isEmpty()) {
                    Files.delete(p);
                }
            }
            return;
        }
        Files.delete(p);
    }

    /** Temporary files are created owner-only; results are ordinary files readable by everyone (rw-r--r--). */
    private static void readableByAll(Path p) throws IOException {
        try {
            Files.setPosixFilePermissions(p, java.nio.file.attribute.PosixFilePermissions.fromString("rw-r--r--"));
        } catch (UnsupportedOperationException e) {
            // not a POSIX file system: keep its defaults
        }
    }

    /** Writes every file; returns the folder. */
    public Path commit() {
        checkWritable();
        try {
            Files.createDirectories(dir);
            for (Map.Entry<String, byte[]> e : files.entrySet()) {
                Path target = dir.resolve(e.getKey());
                Files.createDirectories(target.getParent());
                Path tmp = Files.createTempFile(target.getParent(), "." + e.getKey().replace('/', '_'), ".part");
                try {
                    Files.write(tmp, e.getValue());
                    readableByAll(tmp);
                    try {
                        Files.move(tmp, target, StandardCopyOption.REPLACE_EXISTING, StandardCopyOption.ATOMIC_MOVE);
                    } catch (AtomicMoveNotSupportedException ex) {
                        Files.move(tmp, target, StandardCopyOption.REPLACE_EXISTING);
                    }
                } finally {
                    Files.deleteIfExists(tmp);
                }
            }
            for (String name : owned) {
                prune(dir.resolve(name), name);
            }
        } catch (IOException e) {
            throw new InputException(ErrorKind.OUTPUT, dir.toString(), "", 0, "cannot write: " + e.getMessage());
        }
        return dir;
    }
}
