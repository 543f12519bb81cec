package steelyard.report;

import java.nio.file.Files;
import java.nio.file.Path;
import java.util.List;
import java.util.Map;
import steelyard.io.InputException;
import steelyard.io.OutputSet;
import steelyard.io.OutputTarget;

/** Guards against an output overwriting one of the command's own inputs, or two outputs sharing a file ({@link OutputSet#refuseClashes}). */
public final class OutputPaths {
  private OutputPaths() {}

  /**
   * Throws an {@link steelyard.io.InputException} naming the option when an output path (keyed by its option, null values
   * ignored) is an input path or another output's path, or when more than one output is {@code -} (stdout).
   */
  public static void refuseClashes(Map<String, Path> outputsByOption, List<Path> inputs) {
    OutputSet.refuseClashes(outputsByOption, inputs);
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

  /** Whether {@code p} is standard output: {@code -}, or this process's {@code /dev/stdout} ({@link OutputTarget.Kind#STDOUT}). */
  public static boolean isStdout(Path p) {
    return p != null && OutputTarget.kind(p) == OutputTarget.Kind.STDOUT;
  }
}
