package steelyard.io;

import static org.assertj.core.api.Assertions.assertThat;
import static org.assertj.core.api.Assertions.assertThatThrownBy;

import java.io.BufferedReader;
import java.io.ByteArrayOutputStream;
import java.io.IOException;
import java.io.InputStreamReader;
import java.io.PrintStream;
import java.nio.charset.StandardCharsets;
import java.nio.file.Files;
import java.nio.file.Path;
import java.util.List;
import java.util.concurrent.TimeUnit;
import java.util.stream.Stream;
import org.junit.jupiter.api.Test;
import org.junit.jupiter.params.ParameterizedTest;
import org.junit.jupiter.params.provider.ValueSource;
import org.junit.jupiter.api.io.TempDir;

class AtomicOutputTest {
  @TempDir Path dir;

  private List<Path> temporaryFiles() throws IOException {
    try (Stream<Path> s = Files.list(dir)) {
      return s.filter(p -> p.getFileName().toString().contains(AtomicOutput.TEMP_INFIX)).sorted().toList();
    }
  }

  @Test
  void replacesTheTargetWholeAndLeavesNoTemporaryFile() throws IOException {
    Path target = dir.resolve("out.csv");
    Files.writeString(target, "old content that is longer than the new one\n");
    AtomicOutput.writeText(target, w -> w.write("new\n"));
    assertThat(Files.readString(target)).isEqualTo("new\n");
    assertThat(temporaryFiles()).isEmpty();
  }

  @Test
  void createsAMissingTargetAndWritesUtf8() throws IOException {
    Path target = dir.resolve("new.txt");
    AtomicOutput.writeText(target, w -> w.write("Äpfel ✓\n"));
    assertThat(Files.readAllBytes(target)).isEqualTo("Äpfel ✓\n".getBytes(StandardCharsets.UTF_8));
  }

  @Test
  void failureInTheBodyLeavesTheOldFileAndNoTemporaryFile() throws IOException {
    Path target = dir.resolve("out.csv");
    Files.writeString(target, "old\n");
    assertThatThrownBy(() -> AtomicOutput.writeText(target, w -> {
      w.write("partial ".repeat(100_000));
      throw new IllegalStateException("boom");
    })).isInstanceOf(IllegalStateException.class).hasMessage("boom");
    assertThat(Files.readString(target)).isEqualTo("old\n");
    assertThat(temporaryFiles()).isEmpty();
  }

  @Test
  void ioFailureInTheBodyBecomesAnInputErrorNamingTheTarget() throws IOException {
    Path target = dir.resolve("out.bin");
    assertThatThrownBy(() -> AtomicOutput.writeBytes(target, o -> {
      o.write(1);
      throw new IOException("No space left on device");
    })).isInstanceOf(InputException.class).hasMessageStartingWith(target + ": cannot write output (");
    assertThat(Files.exists(target)).isFalse();
    assertThat(temporaryFiles()).isEmpty();
  }

  @Test
  void bodyMayCloseItsWriter() throws IOException {
    Path target = dir.resolve("closed.txt");
    AtomicOutput.writeText(target, w -> {
      w.write("done");
      w.close();
    });
    assertThat(Files.readString(target)).isEqualTo("done");
  }

  @Test
  void writesThroughASymbolicLinkAndKeepsTheLink() throws IOException {
    Path real = Files.writeString(Files.createDirectories(dir.resolve("store")).resolve("picks.csv"), "old\n");
    Path link = Files.createSymbolicLink(dir.resolve("picks.csv"), real);
    AtomicOutput.writeText(link, w -> w.write("new\n"));
    assertThat(Files.isSymbolicLink(link)).isTrue();
    assertThat(Files.readString(real)).isEqualTo("new\n");
  }

  @Test
  void writesBinaryBodies() throws IOException {
    Path target = dir.resolve("model.bin");
    AtomicOutput.writeBytes(target, o -> o.write(new byte[] {0, 1, 2, (byte) 0xff}));
    assertThat(Files.readAllBytes(target)).containsExactly(0, 1, 2, 0xff);
  }

  @Test
  void dashWritesToStdoutWithoutClosingIt() {
    PrintStream saved = System.out;
    ByteArrayOutputStream buf = new ByteArrayOutputStream();
    boolean[] closed = {false};
    PrintStream capture = new PrintStream(buf, true, StandardCharsets.UTF_8) {
      @Override
      public void close() {
        closed[0] = true;
      }
    };
    System.setOut(capture);
    try {
      AtomicOutput.writeText(Path.of("-"), w -> {
        w.write("to stdout\n");
        w.close();
      });
    } finally {
      System.setOut(saved);
    }
    assertThat(buf.toString(StandardCharsets.UTF_8)).isEqualTo("to stdout\n");
    assertThat(closed[0]).isFalse();
  }

  @ParameterizedTest
  @ValueSource(strings = {"-", "/dev/stdout", "/dev/fd/1"})
  void standardOutputGoesToTheCommandsOwnWriterWhichStaysOpen(String name) {
    java.io.StringWriter sw = new java.io.StringWriter();
    boolean[] closed = {false};
    java.io.PrintWriter commandOut = new java.io.PrintWriter(sw) {
      @Override
      public void close() {
        closed[0] = true;
      }
    };
    AtomicOutput.writeText(Path.of(name), commandOut, w -> {
      w.write("to the command's stdout\n");
      w.close();
    });
    assertThat(sw.toString()).isEqualTo("to the command's stdout\n");
    assertThat(closed[0]).isFalse();
  }

  @Test
  void aFailingCommandWriterIsAnInputErrorNotASilentLoss() {
    java.io.PrintWriter broken = new java.io.PrintWriter(java.io.Writer.nullWriter()) {
      @Override
      public boolean checkError() {
        return true;
      }
    };
    assertThatThrownBy(() -> AtomicOutput.writeText(Path.of("-"), broken, w -> w.write("lost\n")))
        .isInstanceOf(InputException.class).hasMessageContaining("cannot write to standard output");
  }

  @Test
  void missingDirectoryIsAnInputError() {
    Path target = dir.resolve("no/such/dir/out.csv");
    assertThatThrownBy(() -> AtomicOutput.writeText(target, w -> w.write("x")))
        .isInstanceOf(InputException.class)
        .hasMessageContaining("does not exist; expected an output path in an existing directory");
  }

  @Test
  void refusesAnOutputThatIsAnInputByAnyPath() throws IOException {
    Path in = Files.writeString(dir.resolve("hyps.csv"), "utt_id,text\n");
    Path other = dir.resolve("sub/../hyps.csv");
    Files.createDirectories(dir.resolve("sub"));
    Path link = Files.createSymbolicLink(dir.resolve("link.csv"), in);
    for (Path out : List.of(in, other, link)) {
      assertThatThrownBy(() -> AtomicOutput.refuseOverwritingInput(out, dir.resolve("refs.csv"), in))
          .isInstanceOf(InputException.class)
          .hasMessage(out + ": output path is the input file " + in + "; expected an output path different from every input file");
    }
    AtomicOutput.refuseOverwritingInput(dir.resolve("picks.csv"), in);
    AtomicOutput.refuseOverwritingInput(Path.of("-"), Path.of("-"), in);
  }

  @Test
  void killedWriteKeepsTheOldOutputAndTheNextRunRemovesItsLeftover() throws Exception {
    Path target = dir.resolve("picks.csv");
    Files.writeString(target, "old output\n");
    Process child = startChild(target, 100_000, "-D" + AtomicOutput.PAUSE_PROPERTY + "=5000");
    try (BufferedReader err = new BufferedReader(new InputStreamReader(child.getErrorStream(), StandardCharsets.UTF_8))) {
      String line = err.readLine();
      assertThat(line).as("child reports its pause").startsWith("steelyard: test pause: 5000 bytes written to ");
      child.destroyForcibly(); // SIGKILL on POSIX systems
      assertThat(child.waitFor(30, TimeUnit.SECONDS)).isTrue();
    }
    assertThat(Files.readString(target)).isEqualTo("old output\n");
    List<Path> leftover = temporaryFiles();
    assertThat(leftover).singleElement().satisfies(p -> assertThat(Files.size(p)).isEqualTo(5000));
    assertThat(AtomicOutput.staleTemporaryFiles(target)).isEqualTo(leftover);

    Process rerun = startChild(target, 10, null);
    String err = new String(rerun.getErrorStream().readAllBytes(), StandardCharsets.UTF_8);
    assertThat(rerun.waitFor(60, TimeUnit.SECONDS)).isTrue();
    assertThat(rerun.exitValue()).as(err).isZero();
    assertThat(Files.readAllLines(target)).hasSize(10).first().isEqualTo("new line 0 crates to bay 0");
    assertThat(err).as("the rerun names what it removed")
        .contains("removed " + leftover.get(0) + ", left over from an interrupted write (process ");
    assertThat(temporaryFiles()).as("the killed run's temporary file is gone, and the rerun left none").isEmpty();
  }

  private static Process startChild(Path target, int lines, String property) throws IOException {
    String java = Path.of(System.getProperty("java.home"), "bin", "java").toString();
    List<String> cmd = new java.util.ArrayList<>(List.of(java, "-Xmx64m", "-cp", System.getProperty("java.class.path")));
    if (property != null) cmd.add(property);
    cmd.addAll(List.of(AtomicOutputChild.class.getName(), target.toString(), Integer.toString(lines)));
    return new ProcessBuilder(cmd).redirectOutput(ProcessBuilder.Redirect.DISCARD).start();
  }
}
