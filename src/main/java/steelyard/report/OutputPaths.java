package steelyard.report;

import java.nio.file.Path;
import java.util.List;
import java.util.Map;
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

  /** Whether {@code p} is standard output: {@code -}, or this process's {@code /dev/stdout} ({@link OutputTarget.Kind#STDOUT}). */
  public static boolean isStdout(Path p) {
    return p != null && OutputTarget.kind(p) == OutputTarget.Kind.STDOUT;
  }
}
