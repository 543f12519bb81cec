package steelyard.cli;

import static org.assertj.core.api.Assertions.assertThat;
import static org.assertj.core.api.Assertions.assertThatThrownBy;

import java.io.IOException;
import java.nio.charset.StandardCharsets;
import java.nio.file.Path;
import java.util.concurrent.TimeUnit;
import org.junit.jupiter.api.Test;
import picocli.CommandLine;
import steelyard.gui.model.OpenRequest;
import steelyard.io.FeatureSpec;
import steelyard.io.InputException;
import steelyard.rescore.RescoreMethod;
import steelyard.text.Unit;

/** {@code steelyard gui}: what its options open (parsed only; the window itself is tested under Xvfb). */
class GuiCommandTest {
  private static GuiCommand parse(String... args) {
    CommandLine cl = Main.commandLine();
    String[] all = new String[args.length + 1];
    all[0] = "gui";
    System.arraycopy(args, 0, all, 1, args.length);
    cl.parseArgs(all);
    return cl.getSubcommands().get("gui").getCommand();
  }

  @Test
  void withoutFilesItOpensTheDemosVoiceDevSet() {
    OpenRequest r = parse().request();
    assertThat(r.hyps().getFileName().toString()).isEqualTo("voice-dev.nbest.csv");
    assertThat(r.refs().getFileName().toString()).isEqualTo("voice-dev.refs.csv");
    assertThat(r.lm().getFileName().toString()).isEqualTo("voice-3gram.arpa.gz");
    assertThat(r.weights().getFileName().toString()).isEqualTo("voice-demo.weights.json");
    assertThat(r.normalisation().rulesFile().getFileName().toString()).isEqualTo("voice.rules");
    assertThat(r.features()).containsExactlyElementsOf(FeatureSpec.parseList("acoustic,lm"));
  }

  @Test
  void givenFilesAndOptionsReachTheRequest() {
    OpenRequest r = parse("--hyps", "h.csv", "--refs", "r.csv", "--lm", "m.bin", "--weights", "w.json", "--features", "conf:linear",
        "--unit", "char", "--method", "lattice", "--lm-weight", "3", "--max-bad-rows", "2", "--oov-log10-prob", "-9").request();
    assertThat(r.hyps()).isEqualTo(Path.of("h.csv"));
    assertThat(r.refs()).isEqualTo(Path.of("r.csv"));
    assertThat(r.lm()).isEqualTo(Path.of("m.bin"));
    assertThat(r.weights()).isEqualTo(Path.of("w.json"));
    assertThat(r.features()).containsExactlyElementsOf(FeatureSpec.parseList("conf:linear"));
    assertThat(r.unit()).isEqualTo(Unit.CHAR);
    assertThat(r.method()).isEqualTo(RescoreMethod.LATTICE);
    assertThat(r.overrides().lmWeight).isEqualTo(3.0);
    assertThat(r.maxBadRows()).isEqualTo(2);
    assertThat(r.oovLog10Prob()).isEqualTo(-9.0);
  }

  @Test
  void withoutUnitTheUnitIsInferred() {
    assertThat(parse("--hyps", "h.csv").request().unit()).isNull();
  }

  @Test
  void filesWithoutHypothesesAreRefused() {
    assertThatThrownBy(() -> parse("--refs", "r.csv").request()).isInstanceOf(InputException.class)
        .hasMessage("--hyps: missing while --refs, --lm, --weights or --features is given; expected --hyps FILE, or no file options at all for the demo");
  }

  /** Without a display the command says so and exits 2 (run in a JVM of its own, which starts AWT headless). */
  @Test
  void withoutADisplayItExitsWithAMessage() throws IOException, InterruptedException {
    String java = Path.of(System.getProperty("java.home"), "bin", "java").toString();
    ProcessBuilder pb = new ProcessBuilder(java, "-cp", System.getProperty("java.class.path"), Main.class.getName(), "gui");
    pb.environment().remove("DISPLAY");
    pb.environment().remove("WAYLAND_DISPLAY");
    pb.redirectErrorStream(true);
    Process p = pb.start();
    assertThat(p.waitFor(60, TimeUnit.SECONDS)).isTrue();
    String out = new String(p.getInputStream().readAllBytes(), StandardCharsets.UTF_8);
    assertThat(p.exitValue()).as(out).isEqualTo(Main.BAD_INPUT);
    assertThat(out).contains("steelyard: gui: no display to open a window on");
  }
}
