package steelyard.io;

import static org.assertj.core.api.Assertions.assertThat;
import static org.assertj.core.api.Assertions.assertThatThrownBy;

import java.io.IOException;
import java.nio.file.Files;
import java.nio.file.Path;
import java.util.LinkedHashMap;
import java.util.List;
import java.util.Map;
import java.util.stream.Stream;
import org.junit.jupiter.api.Nested;
import org.junit.jupiter.api.Test;
import org.junit.jupiter.api.io.TempDir;

class OutputSetTest {
  @TempDir Path dir;

  private Map<String, Path> outputs(String... optionAndName) {
    Map<String, Path> m = new LinkedHashMap<>();
    for (int i = 0; i < optionAndName.length; i += 2) m.put(optionAndName[i], optionAndName[i + 1] == null ? null : dir.resolve(optionAndName[i + 1]));
    return m;
  }

  private List<String> names() throws IOException {
    try (Stream<Path> s = Files.list(dir)) {
      return s.map(p -> p.getFileName().toString()).sorted().toList();
    }
  }

  @Nested
  class WhileOpen {
    @Test
    void writesAreStagedBesideTheirTargetsAndNotVisibleBeforeTheCommit() throws IOException {
      Files.writeString(dir.resolve("picks.csv"), "old picks\n");
      try (OutputSet set = OutputSet.open(outputs("--out", "picks.csv", "--json", "summary.json"), List.of())) {
        AtomicOutput.writeText(dir.resolve("picks.csv"), w -> w.write("new picks\n"));
        AtomicOutput.writeText(dir.resolve("summary.json"), w -> w.write("{}\n"));
        assertThat(Files.readString(dir.resolve("picks.csv"))).isEqualTo("old picks\n");
        assertThat(dir.resolve("summary.json")).doesNotExist();
        set.commit();
      }
      assertThat(Files.readString(dir.resolve("picks.csv"))).isEqualTo("new picks\n");
      assertThat(Files.readString(dir.resolve("summary.json"))).isEqualTo("{}\n");
      assertThat(names()).containsExactly("picks.csv", "summary.json");
    }

    @Test
    void closingWithoutACommitLeavesEveryTargetAsItWasAndNoTemporaryFile() throws IOException {
      Files.writeString(dir.resolve("picks.csv"), "old picks\n");
      try (OutputSet set = OutputSet.open(outputs("--out", "picks.csv", "--json", "summary.json"), List.of())) {
        AtomicOutput.writeText(dir.resolve("picks.csv"), w -> w.write("new picks\n"));
      }
      assertThat(Files.readString(dir.resolve("picks.csv"))).isEqualTo("old picks\n");
      assertThat(names()).containsExactly("picks.csv");
    }

    @Test
    void aFailingSecondWriteLeavesTheFirstOutputUntouched() throws IOException {
      Files.writeString(dir.resolve("a.csv"), "old a\n");
      try (OutputSet set = OutputSet.open(outputs("--a", "a.csv", "--b", "b.csv"), List.of())) {
        AtomicOutput.writeText(dir.resolve("a.csv"), w -> w.write("new a\n"));
        assertThatThrownBy(() -> AtomicOutput.writeBytes(dir.resolve("b.csv"), o -> {
          throw new IOException("No space left on device");
        })).isInstanceOf(InputException.class).hasMessageContaining("No space left on device");
      }
      assertThat(Files.readString(dir.resolve("a.csv"))).isEqualTo("old a\n");
      assertThat(names()).containsExactly("a.csv");
    }

    @Test
    void pathsOutsideTheSetAreWrittenAtOnce() throws IOException {
      try (OutputSet set = OutputSet.open(outputs("--out", "picks.csv"), List.of())) {
        AtomicOutput.writeText(dir.resolve("other.txt"), w -> w.write("x"));
        assertThat(dir.resolve("other.txt")).hasContent("x");
      }
    }
  }

  @Nested
  class WhenOpening {
    @Test
    void aMissingDirectoryFailsBeforeAnythingIsWrittenAndLeavesNoTemporaryFile() throws IOException {
      Files.writeString(dir.resolve("picks.csv"), "old\n");
      assertThatThrownBy(() -> OutputSet.open(outputs("--out", "picks.csv", "--json", "missing/s.json"), List.of()))
          .isInstanceOf(InputException.class).hasMessageContaining("does not exist");
      assertThat(names()).containsExactly("picks.csv");
    }

    @Test
    void refusesAnOutputThatIsAnInputOrAnotherOutputAndTwoStandardOutputs() throws IOException {
      Path in = Files.writeString(dir.resolve("hyps.csv"), "utt_id,text\n");
      assertThatThrownBy(() -> OutputSet.open(outputs("--out", "hyps.csv"), List.of(in)))
          .hasMessage("--out: output path is the input file " + in + " (also an input: writing would destroy it); expected an output path different from every input file");
      assertThatThrownBy(() -> OutputSet.open(outputs("--out", "x.csv", "--json", "x.csv"), List.of()))
          .hasMessageContaining("is also the output of --out");
      Map<String, Path> twice = new LinkedHashMap<>();
      twice.put("--out", Path.of("-"));
      twice.put("--json", Path.of("/dev/stdout"));
      assertThatThrownBy(() -> OutputSet.open(twice, List.of())).hasMessageContaining("standard output");
    }

    @Test
    void leftoversOfAKilledRunAreRemovedAndNamed() throws IOException {
      // A process number no process has: the writer of this leftover is gone.
      long gone = ProcessHandle.allProcesses().mapToLong(ProcessHandle::pid).max().orElse(1) + 100_000;
      Path leftover = Files.writeString(dir.resolve(".picks.csv" + AtomicOutput.TEMP_INFIX + gone + "-abc"), "half");
      Path older = Files.writeString(dir.resolve(".picks.csv" + AtomicOutput.TEMP_INFIX + "xyz"), "half");
      try (OutputSet set = OutputSet.open(outputs("--out", "picks.csv"), List.of())) {
        set.commit();
      }
      assertThat(leftover).doesNotExist();
      assertThat(older).as("a name without a process number may be someone else's: kept").exists();
    }
  }
}
