package org.exhale.io;

import java.io.IOException;
import java.nio.charset.StandardCharsets;
import java.nio.file.DirectoryStream;
import java.nio.file.Files;
import java.nio.file.LinkOption;
import java.nio.file.Path;
import java.nio.file.StandardCopyOption;
import java.nio.file.attribute.PosixFilePermissions;
import java.util.LinkedHashMap;
import java.util.LinkedHashSet;
import java.util.List;
import java.util.Map;
import java.util.Set;
import java.util.stream.Stream;

/**
 * Collects a command's output files in memory and writes them whole or not at all.
 *
 * <p>The folder is built aside, as a hidden sibling ({@code .NAME.new-…}) holding every new file and,
 * with {@code force}, the files of the old folder this run does not own (hard links, else copies),
 * and is then swapped in by renaming: a new folder appears in one rename, which fails when another
 * writer created the folder meanwhile (two writers cannot both win: the loser is told, and nothing
 * of its result is left); an existing folder is renamed aside, the new one renamed in, the old one
 * deleted. If anything fails before the swap, the old folder is untouched. Where the folder cannot
 * be renamed (it is the working folder or holds it, or its parent is not writable) the new files
 * are staged inside it and moved into place one by one after every write has succeeded.
 *
 * <p>An existing folder with files in it is only replaced with {@code force}.
 */
public final class OutputFolder {
    private final Path dir;
    private final boolean force;
    private final Map<String, byte[]> files = new LinkedHashMap<>();
    private final Set<String> owned = new LinkedHashSet<>();

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
        if (!force && !isEmptyOrAbsent()) {
            throw new InputException(ErrorKind.OUTPUT, dir.toString(), "", 0,
                    "output folder exists and is not empty; use --force to overwrite its files");
        }
    }

    private boolean isEmptyOrAbsent() {
        if (!Files.isDirectory(dir)) {
            return true;
        }
        try (DirectoryStream<Path> s = Files.newDirectoryStream(dir)) {
            return !s.iterator().hasNext();
        } catch (IOException e) {
            throw new InputException(ErrorKind.OUTPUT, dir.toString(), "", 0, "cannot read folder: " + Messages.of(e));
        }
    }

    /**
     * Names (files or folders) this command writes in some runs: whichever of them this run does not
     * write are removed, so that a reused folder never mixes a new result with an old one (an
     * infeasible plan beside the previous plan's recipe, for instance).
     */
    public OutputFolder owns(String... names) {
        owned.addAll(List.of(names));
        return this;
    }

    public void put(String name, String content) {
        files.put(name, content.getBytes(StandardCharsets.UTF_8));
    }

    public void put(String name, byte[] content) {
        files.put(name, content.clone());
    }

    /** Writes every file; returns the folder. */
    public Path commit() {
        checkWritable();
        Path abs = dir.toAbsolutePath().normalize();
        Path parent = abs.getParent();
        if (parent == null) {
            throw new InputException(ErrorKind.OUTPUT, dir.toString(), "", 0, "cannot write into the root folder");
        }
        try {
            Files.createDirectories(parent);
        } catch (IOException e) {
            throw new InputException(ErrorKind.OUTPUT, dir.toString(), "", 0, "cannot create the parent folder: " + Messages.of(e));
        }
        boolean exists = Files.isDirectory(abs);
        if (exists && (holdsWorkingFolder(abs) || !Files.isWritable(parent))) {
            writeInPlace(abs);
            return dir;
        }
        Path stage = null;
        try {
            stage = Files.createTempDirectory(parent, "." + abs.getFileName() + ".new-");
            sharedFolder(stage);
            writeFiles(stage);
            if (exists && force) {
                carryOver(abs, stage, "");
            }
            swapIn(stage, abs, exists);
            stage = null;
        } catch (IOException e) {
            throw new InputException(ErrorKind.OUTPUT, dir.toString(), "", 0, "cannot write: " + Messages.of(e)
                    + "; nothing was written", e);
        } finally {
            if (stage != null) {
                deleteTree(stage);
            }
        }
        return dir;
    }

    /** Renames the staged folder into place; a folder that appeared meanwhile makes this writer lose. */
    private void swapIn(Path stage, Path target, boolean existed) throws IOException {
        if (!existed || !force || isEmptyOrAbsent()) {
            renameExclusive(stage, target);
            return;
        }
        Path old = target.resolveSibling("." + target.getFileName() + ".old-" + Long.toHexString(System.nanoTime()));
        try {
            Files.move(target, old, StandardCopyOption.ATOMIC_MOVE);
        } catch (java.nio.file.NoSuchFileException e) {
            // another writer moved it away first: race it for the empty place
            renameExclusive(stage, target);
            return;
        }
        try {
            renameExclusive(stage, target);
        } catch (InputException | IOException e) {
            try {
                Files.move(old, target, StandardCopyOption.ATOMIC_MOVE);
            } catch (IOException restore) {
                e.addSuppressed(restore);
            }
            throw e;
        }
        deleteTree(old);
    }

    /**
     * rename(2) of a folder onto a path that is absent or an empty folder succeeds; onto a folder with
     * files it fails: the writer that renames first wins, the other is told.
     */
    private void renameExclusive(Path stage, Path target) throws IOException {
        try {
            Files.move(stage, target, StandardCopyOption.ATOMIC_MOVE);
        } catch (IOException e) {
            if (Files.isDirectory(target) && !isEmptyOrAbsent()) {
                throw new InputException(ErrorKind.OUTPUT, dir.toString(), "", 0,
                        "another run wrote this output folder while this one was running; its result is kept and "
                                + "this run's result was not written (choose another folder with -o, or run again with --force)", e);
            }
            throw e;
        }
    }

    private void writeFiles(Path root) throws IOException {
        for (Map.Entry<String, byte[]> e : files.entrySet()) {
            Path target = root.resolve(e.getKey());
            Files.createDirectories(target.getParent());
            Files.write(target, e.getValue());
            readableByAll(target);
        }
    }

    /**
     * Brings the old folder's files this run neither writes nor owns into the staged folder (hard
     * links where the file system has them): with --force the command replaces its own files and
     * keeps any others.
     */
    private void carryOver(Path from, Path to, String rel) throws IOException {
        try (Stream<Path> s = Files.list(from)) {
            for (Path p : (Iterable<Path>) s::iterator) {
                String name = p.getFileName().toString();
                String r = rel.isEmpty() ? name : rel + "/" + name;
                if (files.containsKey(r) || rel.isEmpty() && owned.contains(name) || isOwnedBelow(r)) {
                    continue;
                }
                Path q = to.resolve(name);
                if (Files.isDirectory(p, LinkOption.NOFOLLOW_LINKS)) {
                    Files.createDirectories(q);
                    sharedFolder(q);
                    carryOver(p, q, r);
                } else if (!Files.exists(q, LinkOption.NOFOLLOW_LINKS)) {
                    try {
                        Files.createLink(q, p);
                    } catch (IOException | UnsupportedOperationException e) {
                        Files.copy(p, q, StandardCopyOption.COPY_ATTRIBUTES, LinkOption.NOFOLLOW_LINKS);
                    }
                }
            }
        }
    }

    private boolean isOwnedBelow(String rel) {
        for (String o : owned) {
            if (rel.startsWith(o + "/")) {
                return true;
            }
        }
        return false;
    }

    /**
     * The folder cannot be renamed: stage the new files inside it, and only when every one is written
     * move them into place (each move atomic) and prune what this run owns but did not write.
     */
    private void writeInPlace(Path abs) {
        Path stage = null;
        try {
            for (String name : files.keySet()) {
                Path target = abs.resolve(name);
                if (Files.isDirectory(target, LinkOption.NOFOLLOW_LINKS)) {
                    throw new InputException(ErrorKind.OUTPUT, target.toString(), "", 0,
                            "is a folder where this run writes a file; nothing was written");
                }
            }
            stage = Files.createTempDirectory(abs, ".exhale-new-");
            writeFiles(stage);
            for (String name : files.keySet()) {
                Path target = abs.resolve(name);
                Files.createDirectories(target.getParent());
                Files.move(stage.resolve(name), target, StandardCopyOption.REPLACE_EXISTING, StandardCopyOption.ATOMIC_MOVE);
            }
            for (String name : owned) {
                prune(abs.resolve(name), name);
            }
        } catch (IOException e) {
            throw new InputException(ErrorKind.OUTPUT, dir.toString(), "", 0, "cannot write: " + Messages.of(e), e);
        } finally {
            if (stage != null) {
                deleteTree(stage);
            }
        }
    }

    /** Removes what lies at {@code rel} unless this run wrote it (folders: their files this run did not write). */
    private void prune(Path p, String rel) throws IOException {
        if (!Files.exists(p, LinkOption.NOFOLLOW_LINKS) || files.containsKey(rel)) {
            return;
        }
        if (Files.isDirectory(p, LinkOption.NOFOLLOW_LINKS)) {
            try (Stream<Path> s = Files.list(p)) {
                for (Path c : (Iterable<Path>) s::iterator) {
                    prune(c, rel + "/" + c.getFileName());
                }
            }
            try (Stream<Path> s = Files.list(p)) {
                if (s.findAny().isEmpty()) {
                    Files.delete(p);
                }
            }
            return;
        }
        Files.delete(p);
    }

    private static boolean holdsWorkingFolder(Path abs) {
        try {
            Path cwd = Path.of("").toAbsolutePath().toRealPath();
            return cwd.startsWith(abs.toRealPath());
        } catch (IOException e) {
            return true;
        }
    }

    /** Results are ordinary files readable by everyone (rw-r--r--); temporary files are created owner-only. */
    private static void readableByAll(Path p) throws IOException {
        try {
            Files.setPosixFilePermissions(p, PosixFilePermissions.fromString("rw-r--r--"));
        } catch (UnsupportedOperationException e) {
            // not a POSIX file system: keep its defaults
        }
    }

    /** The staged folder becomes the output folder: rwxr-xr-x like a folder made by mkdir under the usual umask. */
    private static void sharedFolder(Path p) throws IOException {
        try {
            Files.setPosixFilePermissions(p, PosixFilePermissions.fromString("rwxr-xr-x"));
        } catch (UnsupportedOperationException e) {
            // not a POSIX file system: keep its defaults
        }
    }

    static void deleteTree(Path p) {
        try {
            if (Files.isDirectory(p, LinkOption.NOFOLLOW_LINKS)) {
                try (Stream<Path> s = Files.list(p)) {
                    for (Path c : (Iterable<Path>) s::iterator) {
                        deleteTree(c);
                    }
                }
            }
            Files.deleteIfExists(p);
        } catch (IOException e) {
            // a leftover hidden temporary is harmless; the error worth reporting is the original one
        }
    }
}
