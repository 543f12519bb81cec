package steelyard.cli;

import com.fasterxml.jackson.databind.JsonNode;
import java.io.PrintWriter;
import java.nio.file.Path;
import picocli.CommandLine.Option;
import steelyard.io.JsonOutput;
import steelyard.report.OutputPaths;

/** {@code --json FILE|-}: the JSON summary of every command that writes one. */
public final class JsonOutputOption {
  @Option(names = "--json", paramLabel = "FILE|-", description = "Write the JSON summary to FILE, or to stdout with '-'.")
  public Path file;

  /** Whether the summary goes to stdout (so a text report, if any, moves or is left out). */
  public boolean toStdout() {
    return OutputPaths.isStdout(file);
  }

  /** Writes {@code node} atomically to the file, or to {@code stdout}; nothing when the option is not given. */
  public void write(JsonNode node, PrintWriter stdout) {
    if (file != null) JsonOutput.write(file, node, stdout);
  }
}
