package steelyard.report;

import java.nio.file.Path;
import java.util.List;
import java.util.Map;
import steelyard.io.OutputSet;

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

  /** Whether {@code p} is {@code -}, standard output. */
  public static boolean isStdout(Path p) {
    return p != null && p.toString().equals("-");
  }
}
