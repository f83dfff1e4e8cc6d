package org.exhale.io;

import java.io.IOException;
import java.nio.file.AccessDeniedException;
import java.nio.file.DirectoryNotEmptyException;
import java.nio.file.FileAlreadyExistsException;
import java.nio.file.FileSystemException;
import java.nio.file.NoSuchFileException;
import java.nio.file.NotDirectoryException;

/** Why an operation on a file failed, in words, without the names of Java's exception classes. */
public final class Messages {
    private Messages() {
    }

    public static String of(IOException e) {
        if (e instanceof NoSuchFileException f) {
            return "no such file or folder: " + f.getFile();
        }
        if (e instanceof AccessDeniedException f) {
            return "permission denied: " + f.getFile();
        }
        if (e instanceof FileAlreadyExistsException f) {
            return "already exists: " + f.getFile();
        }
        if (e instanceof DirectoryNotEmptyException f) {
            return "folder not empty: " + f.getFile();
        }
        if (e instanceof NotDirectoryException f) {
            return "not a folder: " + f.getFile();
        }
        if (e instanceof FileSystemException f) {
            String reason = f.getReason() == null ? "failed" : f.getReason();
            return f.getFile() == null ? reason : reason + ": " + f.getFile();
        }
        return e.getMessage() == null ? "input/output error" : e.getMessage();
    }
}
