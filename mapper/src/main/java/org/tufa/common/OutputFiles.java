package org.tufa.common;

import java.io.BufferedOutputStream;
import java.io.BufferedWriter;
import java.io.IOException;
import java.io.OutputStream;
import java.io.OutputStreamWriter;
import java.io.Writer;
import java.nio.charset.StandardCharsets;
import java.nio.file.AtomicMoveNotSupportedException;
import java.nio.file.FileAlreadyExistsException;
import java.nio.file.Files;
import java.nio.file.NoSuchFileException;
import java.nio.file.AccessDeniedException;
import java.nio.file.NotDirectoryException;
import java.nio.file.Path;
import java.nio.file.StandardCopyOption;
import java.util.ArrayList;
import java.util.LinkedHashMap;
import java.util.List;
import java.util.Map;

/**
 * Every file tufa writes goes through here: the content is written to a temporary file in the target's own folder
 * and renamed into place, so a reader never sees a half-written output and a failed write (a full disk, a file
 * size limit, a folder that cannot hold files) leaves the old file, if any, untouched and no temporary file behind.
 * A rename within one folder is atomic on POSIX file systems (rename(2)); where the file system refuses an atomic
 * move, a plain replacing move is used.
 *
 * <p>Failures are {@link InputException}s naming the file and the reason in words ("the disk is full or the file
 * is too large"), never a bug report: the command exits 1.
 */
public final class OutputFiles {

    /** Writes the content of one file. */
    @FunctionalInterface
    public interface Content<T> {
        void writeTo(T out) throws IOException;
    }

    /** Names of temporary files only; never part of any output. */
    private static final java.security.SecureRandom RANDOM = new java.security.SecureRandom();

    private OutputFiles() {
    }

    /** Writes text as UTF-8. */
    public static void writeString(Path target, CharSequence text) {
        writeText(target, w -> w.append(text));
    }

    /** Writes text through a buffered UTF-8 writer. */
    public static void writeText(Path target, Content<Writer> content) {
        write(target, out -> {
            Writer w = new BufferedWriter(new OutputStreamWriter(out, StandardCharsets.UTF_8), 1 << 16);
            content.writeTo(w);
            w.flush();
        });
    }

    /** Writes bytes through a buffered stream: temporary file beside the target, then a rename. */
    public static void write(Path target, Content<OutputStream> content) {
        Path folder = folderOf(target);
        ensureFolder(folder);
        if (Files.isDirectory(target)) {
            throw InputException.in(target, "is a folder; name a file to write");
        }
        String name = target.getFileName().toString();
        // Not Files.createTempFile: its owner-only permissions would stay on the output after the rename; this
        // file gets the permissions any new file gets (the umask), like the target would.
        Path temp = folder.resolve("." + (name.length() > 40 ? name.substring(0, 40) : name) + "."
                + Long.toHexString(RANDOM.nextLong() & Long.MAX_VALUE) + ".part");
        boolean moved = false;
        try {
            try (OutputStream out = new BufferedOutputStream(Files.newOutputStream(temp,
                    java.nio.file.StandardOpenOption.CREATE_NEW, java.nio.file.StandardOpenOption.WRITE), 1 << 16)) {
                content.writeTo(out);
            }
            try {
                Files.move(temp, target, StandardCopyOption.ATOMIC_MOVE, StandardCopyOption.REPLACE_EXISTING);
            } catch (AtomicMoveNotSupportedException e) {
                Files.move(temp, target, StandardCopyOption.REPLACE_EXISTING);
            }
            moved = true;
        } catch (IOException e) {
            throw failure(target, e);
        } catch (java.io.UncheckedIOException e) {
            throw failure(target, e.getCause());
        } catch (RuntimeException e) {
            // Jena's writers wrap the stream's IOException in their own unchecked exception.
            IOException io = ioCause(e);
            if (io != null) {
                throw failure(target, io);
            }
            throw e;
        } finally {
            if (!moved) {
                try {
                    Files.deleteIfExists(temp);
                } catch (IOException ignored) {
                    // nothing more can be done; the write error is what the user needs to see
                }
            }
        }
    }

    /**
     * Makes sure {@code folder} is a folder tufa can write into, creating it (and its parents) when missing.
     *
     * @throws InputException when it is a plain file, or cannot be created
     */
    public static void ensureFolder(Path folder) {
        if (Files.isDirectory(folder)) {
            return;
        }
        if (Files.exists(folder)) {
            throw InputException.in(folder, "is a file, not a folder; give a folder for the outputs (or remove the file)");
        }
        try {
            Files.createDirectories(folder);
        } catch (FileAlreadyExistsException e) {
            throw InputException.in(folder, "a part of this path is a file, not a folder; give another output folder");
        } catch (IOException e) {
            throw InputException.in(folder, "cannot create the folder (" + reason(e) + "); give another output folder");
        }
    }

    /**
     * Checks, without creating anything, that {@code folder} can become an output folder: it is a folder, or it does
     * not exist and its nearest existing ancestor is a folder.
     *
     * @param option names the folder in the message ("--out")
     */
    public static void checkFolder(String option, Path folder) {
        Path p = folder.toAbsolutePath().normalize();
        if (Files.exists(p) && !Files.isDirectory(p)) {
            throw InputException.in(folder, option + " names a file, not a folder; give a folder for the outputs");
        }
        for (Path a = p.getParent(); a != null; a = a.getParent()) {
            if (Files.exists(a)) {
                if (!Files.isDirectory(a)) {
                    throw InputException.in(folder, option + ": " + a + " is a file, not a folder; give another "
                            + "output folder");
                }
                return;
            }
        }
    }

    /**
     * Refuses, before anything is written, outputs that would overwrite an input or each other.
     *
     * @param inputs files the command reads, by what names them ("--points")
     * @param outputs files the command will write, by what names them ("--out")
     * @throws InputException naming both options and the file
     */
    public static void checkDistinct(Map<String, Path> inputs, Map<String, Path> outputs) {
        List<Map.Entry<String, Path>> outs = new ArrayList<>(outputs.entrySet());
        Map<String, Path> canonicalOutputs = new LinkedHashMap<>();
        for (Map.Entry<String, Path> out : outs) {
            if (out.getValue() == null) {
                continue;
            }
            Path key = canonical(out.getValue());
            for (Map.Entry<String, Path> in : inputs.entrySet()) {
                if (in.getValue() != null && canonical(in.getValue()).equals(key)) {
                    throw InputException.in(out.getValue(), out.getKey() + " names the same file as " + in.getKey()
                            + "; writing it would destroy the input: choose another output file");
                }
            }
            for (Map.Entry<String, Path> seen : canonicalOutputs.entrySet()) {
                if (seen.getValue().equals(key)) {
                    throw InputException.in(out.getValue(), out.getKey() + " and " + seen.getKey()
                            + " name the same file; one would overwrite the other: give each its own file");
                }
            }
            canonicalOutputs.put(out.getKey(), key);
        }
    }

    /** The real path of a file (links followed) when it exists, else its real folder plus its name. */
    public static Path canonical(Path file) {
        Path absolute = file.toAbsolutePath().normalize();
        try {
            if (Files.exists(absolute)) {
                return absolute.toRealPath();
            }
            Path parent = absolute.getParent();
            if (parent != null && Files.exists(parent)) {
                return parent.toRealPath().resolve(absolute.getFileName());
            }
        } catch (IOException e) {
            // fall back to the normalised absolute path
        }
        return absolute;
    }

    private static Path folderOf(Path target) {
        Path parent = target.toAbsolutePath().normalize().getParent();
        return parent == null ? target.toAbsolutePath().getRoot() : parent;
    }

    private static InputException failure(Path target, IOException e) {
        return InputException.in(target, "cannot write (" + reason(e) + "); check the path, the free disk space "
                + "and the permissions");
    }

    /** The reason of an I/O failure in words, without Java class names. */
    public static String reason(IOException e) {
        String message = String.valueOf(e.getMessage());
        if (message.contains("No space left") || message.contains("File too large") || message.contains("Disk quota")) {
            return "the disk is full or the file is larger than allowed: " + message.strip();
        }
        if (e instanceof AccessDeniedException) {
            return "permission denied";
        }
        if (e instanceof NoSuchFileException) {
            return "no such folder, or the folder does not accept files";
        }
        if (e instanceof NotDirectoryException) {
            return "a part of the path is a file, not a folder";
        }
        return message.lines().findFirst().orElse("I/O error").strip();
    }

    private static IOException ioCause(Throwable e) {
        for (Throwable t = e; t != null; t = t.getCause()) {
            if (t instanceof IOException io) {
                return io;
            }
        }
        return null;
    }
}
