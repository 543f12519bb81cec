package steelyard.io;

import java.io.BufferedOutputStream;
import java.io.BufferedWriter;
import java.io.FilterOutputStream;
import java.io.FilterWriter;
import java.io.IOException;
import java.io.InterruptedIOException;
import java.io.OutputStream;
import java.io.OutputStreamWriter;
import java.io.PrintStream;
import java.io.Writer;
import java.nio.channels.Channels;
import java.nio.channels.FileChannel;
import java.nio.charset.StandardCharsets;
import java.nio.file.AtomicMoveNotSupportedException;
import java.nio.file.Files;
import java.nio.file.Path;
import java.nio.file.StandardCopyOption;
import java.nio.file.StandardOpenOption;
import java.util.ArrayList;
import java.util.List;

/**
 * Writes an output file atomically: to a temporary file in the same directory, then moved into place, so a
 * crash leaves either the old file or the complete new one, never a partial one.
 *
 * <p>The temporary file is named {@code .NAME.steelyard-tmp-PID-RANDOM} beside the target (see
 * {@link TempFiles}), flushed and forced to disk ({@link FileChannel#force}) before an atomic rename (a plain
 * replacing move where the file system has no atomic rename). On any failure, including an exception from the
 * body, the temporary file is deleted and the old target is untouched. A target that is a symbolic link keeps
 * the link and replaces the file it points to (the temporary file goes beside that file). A normal JVM
 * shutdown (Ctrl-C) also deletes unfinished temporary files; a hard kill can leave one behind, which the next
 * write to the same target deletes once the process that wrote it no longer runs (and says so on stderr).
 *
 * <p>Only regular files are replaced ({@link OutputTarget}): {@code -} and this process's own
 * {@code /dev/stdout} or {@code /dev/stderr} are the JVM's streams, and any other existing file that is not a
 * regular file (a device, a FIFO, {@code /dev/fd/N} from process substitution) is written in place, streaming.
 *
 * <p>When an {@link OutputSet} is open on the calling thread and holds the target, the write goes into that
 * set's temporary file and is moved into place only when the set commits, together with the set's other
 * outputs.
 *
 * <p>Test-only switch: the system property {@value #PAUSE_PROPERTY}{@code =N} makes every write pause forever
 * once N bytes are in the temporary file (after printing one line to stderr), so a test can kill the process
 * mid-write and check the old output survived.
 */
public final class AtomicOutput {
  /** System property: pause after this many bytes (tests of interrupted writes only). */
  public static final String PAUSE_PROPERTY = "steelyard.test.pauseAfterBytes";
  /** Infix of temporary file names: {@code .NAME} + this + PID + {@code -} + random. */
  public static final String TEMP_INFIX = ".steelyard-tmp-";

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

  /**
   * Runs {@code body} with the notices that writing outputs gives on the calling thread (a leftover temporary
   * file removed or left alone; one line each, starting {@code steelyard: warning:}) sent to {@code sink}, e.g. a
   * command's own stderr writer; without it they go to {@link System#err}.
   */
  public static <T> T withNotices(java.util.function.Consumer<String> sink, java.util.function.Supplier<T> body) {
    return TempFiles.withNotices(sink, body);
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
   * As {@link #writeText(Path, WriterBody)}, but standard output ({@code -}, or this process's
   * {@code /dev/stdout}: {@link OutputTarget.Kind#STDOUT}) is {@code stdout} (a command's own output writer,
   * e.g. picocli's {@code getOut()}), which is flushed and left open. Every other target, special files and
   * targets staged by an open {@link OutputSet} included, is written as by {@link #writeText(Path, WriterBody)}.
   */
  public static void writeText(Path target, Writer stdout, WriterBody body) {
    if (OutputTarget.kind(target) != OutputTarget.Kind.STDOUT) {
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
      if (stdout instanceof java.io.PrintWriter pw && pw.checkError())
        throw new IOException("the stream reported an error (closed pipe or full disk?)");
    } catch (IOException e) {
      throw InputException.inFile(target, "cannot write to standard output (" + e + ")", null).withCause(e);
    }
  }

  /** Writes bytes to {@code target} (or stdout when it is {@code -}) with the same guarantees as {@link #writeText}. */
  public static void writeBytes(Path target, StreamBody body) {
    switch (OutputTarget.kind(target)) {
      case STDOUT:
        writeStream(target, System.out, body);
        return;
      case STDERR:
        writeStream(target, System.err, body);
        return;
      case IN_PLACE:
        writeInPlace(target, body);
        return;
      default:
        break;
    }
    OutputSet set = OutputSet.holding(target);
    if (set != null) {
      set.stage(target, body);
      return;
    }
    Path abs = checkedTarget(target);
    TempFiles.cleanLeftovers(abs);
    Path tmp = TempFiles.create(target, abs);
    boolean moved = false;
    try {
      writeTemporary(tmp, body);
      copyPermissions(abs, tmp);
      moveIntoPlace(tmp, abs);
      moved = true;
      syncDirectory(abs.getParent());
    } catch (IOException e) {
      throw cannotWrite(target, e);
    } finally {
      TempFiles.finished(tmp, moved);
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

  /**
   * Temporary files beside {@code target} that no write of this process is using, sorted by name: leftovers
   * of killed runs and files other running processes are writing.
   */
  public static List<Path> staleTemporaryFiles(Path target) {
    if (isStdout(target)) return new ArrayList<>();
    return TempFiles.leftovers(target);
  }

  /** The absolute target (symbolic links followed), after checking that it can be replaced: its directory exists. */
  static Path checkedTarget(Path target) {
    Path abs = followLink(target.toAbsolutePath().normalize());
    Path dir = abs.getParent();
    if (Files.isDirectory(abs)) throw InputException.inFile(target, "is a directory", "a file path for the output");
    if (dir == null || !Files.isDirectory(dir)) {
      throw InputException.inFile(target, "directory " + dir + " does not exist", "an output path in an existing directory");
    }
    return abs;
  }

  /** Writes {@code body} into the (existing, empty or stale) temporary file {@code tmp} and forces it to disk. */
  static void writeTemporary(Path tmp, StreamBody body) throws IOException {
    try (FileChannel ch = FileChannel.open(tmp, StandardOpenOption.WRITE, StandardOpenOption.TRUNCATE_EXISTING)) {
      OutputStream os = new BufferedOutputStream(new PausingStream(Channels.newOutputStream(ch), tmp), 1 << 16);
      body.write(new KeepOpen(os));
      os.flush();
      ch.force(true);
    }
  }

  static InputException cannotWrite(Path target, IOException e) {
    return InputException.inFile(target, "cannot write output (" + e + ")", "a writable output path with free space").withCause(e);
  }

  private static boolean isStdout(Path p) {
    return p.toString().equals("-");
  }

  private static void writeStream(Path target, PrintStream stream, StreamBody body) {
    try {
      OutputStream os = new KeepOpen(stream);
      body.write(os);
      os.flush();
      if (stream.checkError()) throw new IOException("the stream reported an error (closed pipe or full disk?)");
    } catch (IOException e) {
      throw InputException.inFile(target, "cannot write to " + (target.toString().equals("-") ? "standard output" : target)
          + " (" + e.getMessage() + ")", null).withCause(e);
    }
  }

  /** Streams into an existing special file (device, FIFO, descriptor); never creates, truncates or replaces it. */
  private static void writeInPlace(Path target, StreamBody body) {
    try (OutputStream raw = Files.newOutputStream(target, StandardOpenOption.WRITE, StandardOpenOption.APPEND)) {
      OutputStream os = new BufferedOutputStream(raw, 1 << 16);
      body.write(new KeepOpen(os));
      os.flush();
    } catch (java.nio.file.NoSuchFileException e) {
      throw InputException.inFile(target, "no such file or descriptor", "an open descriptor, an existing device or FIFO, or a regular file path").withCause(e);
    } catch (IOException e) {
      throw cannotWrite(target, e);
    }
  }

  static void moveIntoPlace(Path tmp, Path abs) throws IOException {
    try {
      Files.move(tmp, abs, StandardCopyOption.ATOMIC_MOVE);
    } catch (AtomicMoveNotSupportedException e) {
      Files.move(tmp, abs, StandardCopyOption.REPLACE_EXISTING);
    }
  }

  /** Keeps an existing target's permission bits, so replacing a file does not change who may read it. */
  static void copyPermissions(Path abs, Path tmp) {
    try {
      if (Files.exists(abs)) Files.setPosixFilePermissions(tmp, Files.getPosixFilePermissions(abs));
    } catch (IOException | UnsupportedOperationException e) {
      // not a POSIX file system, or not our file: the default permissions stand
    }
  }

  /** Makes the rename itself durable; some file systems cannot open directories, which is harmless. */
  static void syncDirectory(Path dir) {
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
