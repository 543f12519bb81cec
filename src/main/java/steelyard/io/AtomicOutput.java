package steelyard.io;

import java.io.BufferedOutputStream;
import java.io.BufferedWriter;
import java.io.FilterOutputStream;
import java.io.FilterWriter;
import java.io.IOException;
import java.io.InterruptedIOException;
import java.io.OutputStream;
import java.io.OutputStreamWriter;
import java.io.Writer;
import java.nio.channels.Channels;
import java.nio.channels.FileChannel;
import java.nio.charset.StandardCharsets;
import java.nio.file.AtomicMoveNotSupportedException;
import java.nio.file.DirectoryStream;
import java.nio.file.FileAlreadyExistsException;
import java.nio.file.Files;
import java.nio.file.Path;
import java.nio.file.StandardCopyOption;
import java.nio.file.StandardOpenOption;
import java.util.ArrayList;
import java.util.List;
import java.util.Set;
import java.util.concurrent.ConcurrentHashMap;
import java.util.concurrent.ThreadLocalRandom;

/**
 * Writes an output file atomically: to a temporary file in the same directory, then moved into place, so a
 * crash leaves either the old file or the complete new one, never a partial one. {@code -} means stdout.
 *
 * <p>The temporary file is named {@code .NAME.steelyard-tmp-RANDOM} beside the target, flushed and forced to
 * disk ({@link FileChannel#force}) before an atomic rename (a plain replacing move where the file system has
 * no atomic rename). On any failure, including an exception from the body, the temporary file is deleted and
 * the old target is untouched. A target that is a symbolic link keeps the link and replaces the file it
 * points to (the temporary file goes beside that file). A normal JVM shutdown (Ctrl-C) also deletes
 * unfinished temporary files. Only a hard kill can leave one behind; such leftovers are reported on stderr
 * by the next write to the same target but never deleted, because a file the tool did not just create may
 * belong to the user.
 *
 * <p>Test-only switch: the system property {@value #PAUSE_PROPERTY}{@code =N} makes every write pause forever
 * once N bytes are in the temporary file (after printing one line to stderr), so a test can kill the process
 * mid-write and check the old output survived.
 */
public final class AtomicOutput {
  /** System property: pause after this many bytes (tests of interrupted writes only). */
  public static final String PAUSE_PROPERTY = "steelyard.test.pauseAfterBytes";
  /** Infix of temporary file names: {@code .NAME} + this + random. */
  public static final String TEMP_INFIX = ".steelyard-tmp-";

  private static final Set<Path> IN_PROGRESS = ConcurrentHashMap.newKeySet();
  private static volatile boolean hookInstalled;

  private AtomicOutput() {}

  /** Body of a write; may throw {@link IOException}. */
  @FunctionalInterface
  public interface WriterBody {
    void write(Writer out) throws IOException;
  }

  /** Body of a binary write; may throw {@link IOException}. Need not close the stream. */
  @FunctionalInterface
  public interface StreamBody {
    void write(OutputStream out) throws IOException;
  }

  /** Writes UTF-8 text to {@code target} (or stdout when it is {@code -}). */
  public static void writeText(Path target, WriterBody body) {
    writeBytes(target, out -> {
      Writer w = new BufferedWriter(new OutputStreamWriter(out, StandardCharsets.UTF_8.newEncoder()), 1 << 16);
      body.write(new FilterWriter(w) {
        @Override
        public void close() throws IOException {
          flush();
        }
      });
      w.flush();
    });
  }

  /**
   * As {@link #writeText(Path, WriterBody)}, but {@code -} writes to {@code stdout} (a command's own output
   * writer, e.g. picocli's {@code getOut()}), which is flushed and left open.
   */
  public static void writeText(Path target, Writer stdout, WriterBody body) {
    if (!isStdout(target)) {
      writeText(target, body);
      return;
    }
    try {
      body.write(new FilterWriter(stdout) {
        @Override
        public void close() throws IOException {
          flush();
        }
      });
      stdout.flush();
    } catch (IOException e) {
      throw InputException.inFile(target, "cannot write to standard output (" + e + ")", null).withCause(e);
    }
  }

  /** Writes bytes to {@code target} (or stdout when it is {@code -}) with the same guarantees as {@link #writeText}. */
  public static void writeBytes(Path target, StreamBody body) {
    if (isStdout(target)) {
      writeStdout(body);
      return;
    }
    Path abs = followLink(target.toAbsolutePath().normalize());
    Path dir = abs.getParent();
    if (Files.isDirectory(abs)) throw InputException.inFile(target, "is a directory", "a file path for the output");
    if (dir == null || !Files.isDirectory(dir)) {
      throw InputException.inFile(target, "directory " + dir + " does not exist", "an output path in an existing directory");
    }
    reportStaleTemporaryFiles(target);
    Path tmp = createTemporary(target, abs);
    boolean moved = false;
    try {
      try (FileChannel ch = FileChannel.open(tmp, StandardOpenOption.WRITE)) {
        OutputStream os = new BufferedOutputStream(new PausingStream(Channels.newOutputStream(ch), tmp), 1 << 16);
        body.write(new KeepOpen(os));
        os.flush();
        ch.force(true);
      }
      copyPermissions(abs, tmp);
      moveIntoPlace(tmp, abs);
      moved = true;
      syncDirectory(dir);
    } catch (IOException e) {
      throw InputException.inFile(target, "cannot write output (" + e + ")", "a writable output path with free space").withCause(e);
    } finally {
      IN_PROGRESS.remove(tmp);
      if (!moved) deleteQuietly(tmp);
    }
  }

  /**
   * Fails with an {@link InputException} when {@code output} is the same file as one of {@code inputs}
   * (same normalised absolute path, or the same existing file through links). {@code -} never conflicts.
   */
  public static void refuseOverwritingInput(Path output, Path... inputs) {
    if (output == null || isStdout(output)) return;
    Path out = output.toAbsolutePath().normalize();
    for (Path input : inputs) {
      if (input == null || isStdout(input)) continue;
      Path in = input.toAbsolutePath().normalize();
      if (out.equals(in) || sameExistingFile(out, in)) {
        throw InputException.option(output.toString(), "output path is the input file " + input,
            "an output path different from every input file");
      }
    }
  }

  /** Leftover temporary files of earlier, killed writes to {@code target}, sorted by name. */
  public static List<Path> staleTemporaryFiles(Path target) {
    List<Path> out = new ArrayList<>();
    if (isStdout(target)) return out;
    Path abs = target.toAbsolutePath().normalize();
    Path dir = abs.getParent();
    if (dir == null || abs.getFileName() == null || !Files.isDirectory(dir)) return out;
    String prefix = "." + abs.getFileName() + TEMP_INFIX;
    try (DirectoryStream<Path> ds = Files.newDirectoryStream(dir, p -> p.getFileName().toString().startsWith(prefix))) {
      for (Path p : ds) if (!IN_PROGRESS.contains(p)) out.add(p);
    } catch (IOException e) {
      return out;
    }
    out.sort(null);
    return out;
  }

  private static boolean isStdout(Path p) {
    return p.toString().equals("-");
  }

  private static void writeStdout(StreamBody body) {
    try {
      OutputStream os = new KeepOpen(System.out);
      body.write(os);
      os.flush();
    } catch (IOException e) {
      throw InputException.inFile(Path.of("-"), "cannot write to standard output (" + e + ")", null).withCause(e);
    }
  }

  private static void reportStaleTemporaryFiles(Path target) {
    for (Path p : staleTemporaryFiles(target)) {
      System.err.println("steelyard: warning: " + p + " is left over from an interrupted write; it is not deleted automatically");
    }
  }

  private static Path createTemporary(Path target, Path abs) {
    installHook();
    for (int attempt = 0; ; attempt++) {
      String random = Long.toUnsignedString(ThreadLocalRandom.current().nextLong(), 36);
      Path tmp = abs.resolveSibling("." + abs.getFileName() + TEMP_INFIX + random);
      try {
        Files.newByteChannel(tmp, StandardOpenOption.CREATE_NEW, StandardOpenOption.WRITE).close();
        IN_PROGRESS.add(tmp);
        return tmp;
      } catch (FileAlreadyExistsException e) {
        if (attempt > 100) throw InputException.inFile(target, "cannot create a temporary file beside it", "a writable directory");
      } catch (IOException e) {
        throw InputException.inFile(target, "cannot create a temporary file beside it (" + e + ")", "a writable directory").withCause(e);
      }
    }
  }

  private static void moveIntoPlace(Path tmp, Path abs) throws IOException {
    try {
      Files.move(tmp, abs, StandardCopyOption.ATOMIC_MOVE);
    } catch (AtomicMoveNotSupportedException e) {
      Files.move(tmp, abs, StandardCopyOption.REPLACE_EXISTING);
    }
  }

  /** Keeps an existing target's permission bits, so replacing a file does not change who may read it. */
  private static void copyPermissions(Path abs, Path tmp) {
    try {
      if (Files.exists(abs)) Files.setPosixFilePermissions(tmp, Files.getPosixFilePermissions(abs));
    } catch (IOException | UnsupportedOperationException e) {
      // not a POSIX file system, or not our file: the default permissions stand
    }
  }

  /** Makes the rename itself durable; some file systems cannot open directories, which is harmless. */
  private static void syncDirectory(Path dir) {
    try (FileChannel d = FileChannel.open(dir, StandardOpenOption.READ)) {
      d.force(true);
    } catch (IOException | RuntimeException e) {
      // best effort
    }
  }

  /** A target that is a symbolic link is written through: the link stays, the file it points to is replaced. */
  private static Path followLink(Path abs) {
    if (!Files.isSymbolicLink(abs)) return abs;
    try {
      return abs.toRealPath();
    } catch (IOException e) {
      return abs; // dangling link: replaced by the new file
    }
  }

  private static boolean sameExistingFile(Path a, Path b) {
    try {
      return Files.exists(a) && Files.exists(b) && Files.isSameFile(a, b);
    } catch (IOException e) {
      return false;
    }
  }

  private static void deleteQuietly(Path p) {
    try {
      Files.deleteIfExists(p);
    } catch (IOException e) {
      System.err.println("steelyard: warning: could not delete temporary file " + p + " (" + e.getMessage() + ")");
    }
  }

  private static void installHook() {
    if (hookInstalled) return;
    synchronized (IN_PROGRESS) {
      if (hookInstalled) return;
      Runtime.getRuntime().addShutdownHook(new Thread(() -> IN_PROGRESS.forEach(AtomicOutput::deleteQuietly), "steelyard-temp-cleanup"));
      hookInstalled = true;
    }
  }

  /** Lets a body close its writer without closing the file before it is forced to disk. */
  private static final class KeepOpen extends FilterOutputStream {
    KeepOpen(OutputStream out) {
      super(out);
    }

    @Override
    public void write(byte[] b, int off, int len) throws IOException {
      out.write(b, off, len);
    }

    @Override
    public void close() throws IOException {
      out.flush();
    }
  }

  /** Counts bytes reaching the temporary file and, when {@value #PAUSE_PROPERTY} is set, stops there. */
  private static final class PausingStream extends FilterOutputStream {
    private final long limit = Long.getLong(PAUSE_PROPERTY, -1L);
    private final Path tmp;
    private long written;

    PausingStream(OutputStream out, Path tmp) {
      super(out);
      this.tmp = tmp;
    }

    @Override
    public void write(int b) throws IOException {
      write(new byte[] {(byte) b}, 0, 1);
    }

    @Override
    public void write(byte[] b, int off, int len) throws IOException {
      if (limit >= 0 && written + len >= limit) {
        int head = (int) Math.max(0, limit - written);
        out.write(b, off, head);
        written += head;
        out.flush();
        pause();
      }
      out.write(b, off, len);
      written += len;
    }

    private void pause() throws IOException {
      System.err.println("steelyard: test pause: " + written + " bytes written to " + tmp);
      System.err.flush();
      try {
        while (true) Thread.sleep(60_000);
      } catch (InterruptedException e) {
        Thread.currentThread().interrupt();
        throw new InterruptedIOException("write paused by " + PAUSE_PROPERTY + " was interrupted");
      }
    }
  }
}
