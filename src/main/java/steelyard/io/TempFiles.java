package steelyard.io;

import java.io.IOException;
import java.nio.file.DirectoryStream;
import java.nio.file.FileAlreadyExistsException;
import java.nio.file.Files;
import java.nio.file.Path;
import java.nio.file.StandardOpenOption;
import java.util.ArrayList;
import java.util.List;
import java.util.Set;
import java.util.concurrent.ConcurrentHashMap;
import java.util.concurrent.ThreadLocalRandom;

/**
 * The temporary files beside output targets: {@code .NAME.steelyard-tmp-PID-RANDOM}, where PID is the writing
 * process. The name says whose file it is, so a later run can tell a leftover of a killed run (its process is
 * gone: the file is deleted, and stderr says so) from a file another run is writing right now (left alone).
 * Files of this process that are still being written are registered here; a normal JVM shutdown (Ctrl-C)
 * deletes them. Notices go to stderr, or to a command's own writer ({@link AtomicOutput#withNotices}).
 */
final class TempFiles {
  private static final Set<Path> IN_PROGRESS = ConcurrentHashMap.newKeySet();
  private static volatile boolean hookInstalled;
  /** Where this thread's notices go (a command's stderr); null: {@link System#err}. */
  private static final ThreadLocal<java.util.function.Consumer<String>> NOTICES = new ThreadLocal<>();

  private TempFiles() {}

  /** Runs {@code body} with this thread's notices (one line each) sent to {@code sink}. */
  static <T> T withNotices(java.util.function.Consumer<String> sink, java.util.function.Supplier<T> body) {
    java.util.function.Consumer<String> before = NOTICES.get();
    NOTICES.set(sink);
    try {
      return body.get();
    } finally {
      if (before == null) NOTICES.remove();
      else NOTICES.set(before);
    }
  }

  /** One line for the user: to the sink of {@link #withNotices} on this thread, else to stderr. */
  private static void notice(String line) {
    java.util.function.Consumer<String> sink = NOTICES.get();
    if (sink != null) sink.accept(line);
    else System.err.println(line);
  }

  /** Creates a new, empty temporary file beside {@code abs} (an absolute target path); {@code target} names it in errors. */
  static Path create(Path target, Path abs) {
    installHook();
    String prefix = prefix(abs) + ProcessHandle.current().pid() + "-";
    for (int attempt = 0; ; attempt++) {
      String random = Long.toUnsignedString(ThreadLocalRandom.current().nextLong(), 36);
      Path tmp = abs.resolveSibling(prefix + random);
      try {
        Files.newByteChannel(tmp, StandardOpenOption.CREATE_NEW, StandardOpenOption.WRITE).close();
        IN_PROGRESS.add(tmp);
        return tmp;
      } catch (FileAlreadyExistsException e) {
        if (attempt > 100) throw InputException.inFile(target, "cannot create a temporary file beside it", "a writable directory");
      } catch (IOException e) {
        throw InputException.inFile(target, "cannot create a temporary file beside it (" + reason(e) + ")",
            "an output path in a writable directory").withCause(e);
      }
    }
  }

  /** Forgets {@code tmp} (moved into place) or deletes it (abandoned). */
  static void finished(Path tmp, boolean moved) {
    IN_PROGRESS.remove(tmp);
    if (!moved) deleteQuietly(tmp);
  }

  /**
   * Temporary files beside {@code target} left by earlier writes that are not in progress in this process,
   * sorted by name: leftovers of killed runs, and files other running processes are writing.
   */
  static List<Path> leftovers(Path target) {
    List<Path> out = new ArrayList<>();
    Path abs = target.toAbsolutePath().normalize();
    Path dir = abs.getParent();
    if (dir == null || abs.getFileName() == null || !Files.isDirectory(dir)) return out;
    String prefix = prefix(abs);
    try (DirectoryStream<Path> ds = Files.newDirectoryStream(dir, p -> p.getFileName().toString().startsWith(prefix))) {
      for (Path p : ds) if (!IN_PROGRESS.contains(p)) out.add(p);
    } catch (IOException e) {
      return out;
    }
    out.sort(null);
    return out;
  }

  /**
   * Deletes the leftovers of killed writes to {@code target} (their process no longer runs) and reports each on
   * stderr; names, without touching them, the temporary files of processes still running and files in the old
   * naming without a process number.
   */
  static void cleanLeftovers(Path target) {
    for (Path p : leftovers(target)) {
      long pid = writerPid(target, p);
      if (pid > 0 && ProcessHandle.of(pid).map(ProcessHandle::isAlive).orElse(false) && pid != ProcessHandle.current().pid()) {
        notice("steelyard: warning: " + p + " is being written by another running process (" + pid + "); left alone");
      } else if (pid > 0) {
        if (deleteQuietly(p))
          notice("steelyard: warning: removed " + p + ", left over from an interrupted write (process " + pid + " no longer runs)");
      } else {
        notice("steelyard: warning: " + p + " is left over from an interrupted write by an older version; it is not deleted automatically");
      }
    }
  }

  /** The PID in a temporary file's name, or −1 when the name has none. */
  static long writerPid(Path target, Path tmp) {
    String rest = tmp.getFileName().toString().substring(prefix(target.toAbsolutePath().normalize()).length());
    int dash = rest.indexOf('-');
    if (dash <= 0 || dash > 18) return -1;
    for (int i = 0; i < dash; i++) if (rest.charAt(i) < '0' || rest.charAt(i) > '9') return -1;
    return Long.parseLong(rest.substring(0, dash));
  }

  static boolean deleteQuietly(Path p) {
    try {
      return Files.deleteIfExists(p);
    } catch (IOException e) {
      notice("steelyard: warning: could not delete temporary file " + p + " (" + e.getMessage() + ")");
      return false;
    }
  }

  private static String prefix(Path abs) {
    return "." + abs.getFileName() + AtomicOutput.TEMP_INFIX;
  }

  private static String reason(IOException e) {
    String simple = e.getClass().getSimpleName();
    if (simple.equals("AccessDeniedException")) return "permission denied";
    if (simple.equals("NoSuchFileException")) return "the directory does not exist";
    return e.getMessage() == null ? simple : e.getMessage();
  }

  private static void installHook() {
    if (hookInstalled) return;
    synchronized (IN_PROGRESS) {
      if (hookInstalled) return;
      Runtime.getRuntime().addShutdownHook(new Thread(() -> IN_PROGRESS.forEach(TempFiles::deleteQuietly), "steelyard-temp-cleanup"));
      hookInstalled = true;
    }
  }
}
