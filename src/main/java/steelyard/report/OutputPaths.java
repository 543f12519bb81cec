package steelyard.report;

import java.io.IOException;
import java.nio.file.Files;
import java.nio.file.Path;
import java.util.ArrayList;
import java.util.List;
import java.util.Map;
import steelyard.io.InputException;

/** Guards against an output overwriting one of the command's own inputs, or two outputs sharing a file. */
public final class OutputPaths {
  private OutputPaths() {}

  /**
   * Throws an {@link InputException} naming the option when an output path (keyed by its option, null values
   * ignored) is an input path or another output's path, or when more than one output is {@code -} (stdout).
   */
  public static void refuseClashes(Map<String, Path> outputsByOption, List<Path> inputs) {
    List<Map.Entry<String, Path>> seen = new ArrayList<>();
    String stdoutTaken = null;
    for (Map.Entry<String, Path> out : outputsByOption.entrySet()) {
      Path p = out.getValue();
      if (p != null && isStdout(p)) {
        if (stdoutTaken != null)
          throw InputException.option(out.getKey(), "standard output ('-') is already the output of " + stdoutTaken, "a file name");
        stdoutTaken = out.getKey();
      }
      if (p == null || isStdout(p)) continue;
      for (Path in : inputs) {
        if (in != null && same(p, in))
          throw InputException.option(out.getKey(), "output " + p + " is also an input file", "a different output path");
      }
      for (Map.Entry<String, Path> other : seen) {
        if (same(p, other.getValue()))
          throw InputException.option(out.getKey(), "output " + p + " is also the output of " + other.getKey(), "a different output path");
      }
      seen.add(out);
    }
  }

  /**
   * Throws an {@link InputException} when an output file (null and {@code -} ignored) cannot be created: its
   * directory does not exist, or the path is a directory. Called before any work, so that a run whose outputs
   * cannot all be written writes none of them.
   */
  public static void requireWritable(Iterable<Path> outputs) {
    for (Path p : outputs) {
      if (p == null || isStdout(p)) continue;
      Path abs = p.toAbsolutePath().normalize();
      if (Files.isDirectory(abs)) throw InputException.inFile(p, "is a directory", "a file path for the output");
      Path dir = abs.getParent();
      if (dir == null || !Files.isDirectory(dir))
        throw InputException.inFile(p, "directory " + dir + " does not exist", "an output path in an existing directory");
    }
  }

  /** Whether {@code p} is {@code -}, standard output. */
  public static boolean isStdout(Path p) {
    return p != null && p.toString().equals("-");
  }

  private static boolean same(Path a, Path b) {
    if (a.toAbsolutePath().normalize().equals(b.toAbsolutePath().normalize())) return true;
    try {
      return Files.exists(a) && Files.exists(b) && Files.isSameFile(a, b);
    } catch (IOException e) {
      return false;
    }
  }
}
