package steelyard.cli;

import static org.assertj.core.api.Assertions.assertThat;

import java.io.IOException;
import java.io.PrintWriter;
import java.io.StringWriter;
import java.nio.file.Files;
import java.nio.file.Path;
import java.util.ArrayList;
import java.util.List;
import java.util.Set;
import java.util.stream.Stream;
import org.junit.jupiter.api.io.TempDir;
import org.junit.jupiter.params.ParameterizedTest;
import org.junit.jupiter.params.provider.MethodSource;
import picocli.CommandLine;

/**
 * The files in {@code models/} are exactly what the commands their READMEs give produce: the two demo models
 * from {@code models/README.md}, the two demo weights files from the README's demo section. Each command is
 * read from the README itself and run with its outputs sent to a temporary folder; the result must equal the
 * committed file byte for byte (so changing what a model or weights file records means regenerating them).
 */
class BundledModelsRebuildTest {
  private static final Set<String> OUTPUT_OPTIONS = Set.of("--out", "--save-weights", "--json");

  @TempDir Path dir;

  /** Every {@code ./steelyard lm train} / {@code rescore} command in the two READMEs that writes into models/. */
  static Stream<List<String>> commands() throws IOException {
    List<List<String>> all = new ArrayList<>();
    for (Path readme : List.of(Path.of("models/README.md"), Path.of("README.md"))) {
      for (List<String> c : shellCommands(Files.readString(readme))) {
        boolean writesModels = false;
        for (int i = 0; i + 1 < c.size(); i++) {
          writesModels |= OUTPUT_OPTIONS.contains(c.get(i)) && c.get(i + 1).startsWith("models/");
        }
        if (writesModels) all.add(c);
      }
    }
    assertThat(all).as("the READMEs' commands for models/").hasSize(4);
    return all.stream();
  }

  @ParameterizedTest(name = "[{index}] {0}")
  @MethodSource("commands")
  void theCommittedFileIsWhatTheReadmeCommandWrites(List<String> command) throws IOException {
    List<String> args = new ArrayList<>();
    Path committed = null;
    Path rebuilt = null;
    for (int i = 0; i < command.size(); i++) {
      String a = command.get(i);
      args.add(a);
      if (OUTPUT_OPTIONS.contains(a) && i + 1 < command.size()) {
        String target = command.get(++i);
        Path local = dir.resolve(i + "-" + Path.of(target).getFileName());
        if (target.startsWith("models/")) {
          committed = Path.of(target);
          rebuilt = local;
        }
        args.add(local.toString());
      }
    }
    CommandLine cl = Main.commandLine();
    StringWriter err = new StringWriter();
    cl.setErr(new PrintWriter(err, true));
    cl.setOut(new PrintWriter(new StringWriter(), true));
    int code = cl.execute(args.subList(1, args.size()).toArray(String[]::new));
    assertThat(code).as(err.toString()).isZero();
    assertThat(err.toString()).doesNotContain("old spelling");
    assertThat(Files.readAllBytes(rebuilt)).as("%s rebuilt by %s", committed, command).isEqualTo(Files.readAllBytes(committed));
  }

  /** The {@code ./steelyard …} commands of the fenced sh blocks of a Markdown text, continuation lines joined. */
  static List<List<String>> shellCommands(String markdown) {
    List<List<String>> out = new ArrayList<>();
    boolean inBlock = false;
    StringBuilder pending = new StringBuilder();
    for (String line : markdown.split("\n")) {
      if (line.startsWith("```")) {
        inBlock = line.equals("```sh");
        continue;
      }
      if (!inBlock) continue;
      pending.append(line.strip());
      if (line.endsWith("\\")) {
        pending.setLength(pending.length() - 1);
        pending.append(' ');
        continue;
      }
      String text = pending.toString().replaceAll("\\s+#.*$", "").strip();
      pending.setLength(0);
      if (text.startsWith("./steelyard ")) out.add(List.of(text.split("\\s+")));
    }
    return out;
  }
}
