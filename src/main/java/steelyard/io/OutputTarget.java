package steelyard.io;

import java.nio.file.Files;
import java.nio.file.Path;
import java.nio.file.attribute.BasicFileAttributes;

/**
 * How an output path is written. Only a regular file (existing or not) may be replaced by a temporary file
 * moved over it; anything else is written in place, streaming, because replacing it would destroy what the
 * user named: a device such as {@code /dev/null} would become a regular file, a FIFO's reader would get
 * nothing, and {@code /dev/stdout} redirected to a file would swap that file's inode under the shell.
 *
 * <ul>
 *   <li>{@link Kind#STDOUT}: {@code -}, and the names of this process's standard output ({@code /dev/stdout},
 *       {@code /dev/fd/1}, {@code /proc/self/fd/1}, {@code /proc/PID/fd/1}): written to {@link System#out};</li>
 *   <li>{@link Kind#STDERR}: the same names for descriptor 2: written to {@link System#err};</li>
 *   <li>{@link Kind#IN_PLACE}: another descriptor name ({@code /dev/fd/N}, {@code /proc/self/fd/N}, as given by
 *       process substitution) or an existing path that is not a regular file or directory (a FIFO, a
 *       character or block device, a socket): opened for appending, never created, never truncated;</li>
 *   <li>{@link Kind#REPLACE}: everything else, i.e. a regular file or a path that does not exist yet.</li>
 * </ul>
 */
public final class OutputTarget {
  private OutputTarget() {}

  /** The ways an output is written. */
  public enum Kind { STDOUT, STDERR, IN_PLACE, REPLACE }

  /** Classifies {@code target}. Cheap: a few string comparisons and at most one {@code stat}. */
  public static Kind kind(Path target) {
    String name = target.toString();
    if (name.equals("-")) return Kind.STDOUT;
    String abs = target.toAbsolutePath().normalize().toString();
    int fd = descriptorOf(abs);
    if (fd == 1) return Kind.STDOUT;
    if (fd == 2) return Kind.STDERR;
    if (fd >= 0) return Kind.IN_PLACE;
    return isSpecialFile(target) ? Kind.IN_PLACE : Kind.REPLACE;
  }

  /** Whether {@code target} exists (links followed) and is neither a regular file nor a directory. */
  public static boolean isSpecialFile(Path target) {
    try {
      BasicFileAttributes a = Files.readAttributes(target, BasicFileAttributes.class);
      return a.isOther();
    } catch (java.io.IOException | UnsupportedOperationException e) {
      return false;
    }
  }

  /** Whether {@code target} is an existing character device (such as {@code /dev/null} or a terminal). */
  public static boolean isCharacterDevice(Path target) {
    try {
      Object mode = Files.getAttribute(target, "unix:mode");
      return mode instanceof Integer m && (m & 0170000) == 0020000;
    } catch (java.io.IOException | UnsupportedOperationException | IllegalArgumentException e) {
      return false;
    }
  }

  /**
   * The descriptor number when {@code abs} names a descriptor of this process ({@code /dev/stdin|stdout|stderr},
   * {@code /dev/fd/N}, {@code /proc/self/fd/N}, {@code /proc/PID/fd/N} with this process's PID), else −1.
   */
  static int descriptorOf(String abs) {
    switch (abs) {
      case "/dev/stdin": return 0;
      case "/dev/stdout": return 1;
      case "/dev/stderr": return 2;
      default: break;
    }
    String rest = null;
    if (abs.startsWith("/dev/fd/")) rest = abs.substring("/dev/fd/".length());
    else if (abs.startsWith("/proc/self/fd/")) rest = abs.substring("/proc/self/fd/".length());
    else {
      String own = "/proc/" + ProcessHandle.current().pid() + "/fd/";
      if (abs.startsWith(own)) rest = abs.substring(own.length());
    }
    if (rest == null || rest.isEmpty() || rest.length() > 9) return -1;
    for (int i = 0; i < rest.length(); i++) if (rest.charAt(i) < '0' || rest.charAt(i) > '9') return -1;
    return Integer.parseInt(rest);
  }
}
