package steelyard.bench;

import java.nio.file.Path;
import java.util.List;
import java.util.concurrent.TimeUnit;
import org.openjdk.jmh.annotations.Benchmark;
import org.openjdk.jmh.annotations.BenchmarkMode;
import org.openjdk.jmh.annotations.Level;
import org.openjdk.jmh.annotations.Mode;
import org.openjdk.jmh.annotations.OutputTimeUnit;
import org.openjdk.jmh.annotations.Param;
import org.openjdk.jmh.annotations.Scope;
import org.openjdk.jmh.annotations.Setup;
import org.openjdk.jmh.annotations.State;
import steelyard.text.NormalisationOptions;
import steelyard.text.Normaliser;
import steelyard.text.RulesFile;
import steelyard.text.TokenSequence;
import steelyard.text.Unit;

/**
 * Normalisation throughput on loading-bay transcript lines (about 12 words each), per option set. One
 * operation normalises one line. Run: {@code java -cp … org.openjdk.jmh.Main NormaliserBench -f 1 -wi 2 -i 3}.
 */
@State(Scope.Benchmark)
@BenchmarkMode(Mode.Throughput)
@OutputTimeUnit(TimeUnit.SECONDS)
public class NormaliserBench {
  private static final String[] LINES = {
      "Okay, uh, the first pallet of plums goes to cold-store bay seven",
      "forklift two is waiting at dock 4 with twelve crates of pears",
      "um [noise] we need 48 kilos of carrots on the 6 o'clock truck",
      "Docket 1187: Apples (Braeburn) x 20, Pears x 12 — signed R. Okafor",
      "the driver says the reefer unit is at minus two degrees",
      "Crème fraîche, 6 tubs; Jalapeños 2 kg; Ｎｏ． 17 café order",
      "hmm right the lettuce goes back to the grower [crosstalk] yes",
      "load the onions first then the potatoes and check the seals",
  };
  private static final String RULES = "equate ok = okay | o.k.\noptional uh | um | hmm | [noise]\ndrop [crosstalk]\n"
      + "equate kg = kilo | kilos\nequate cold store = coldstore\n";

  @Param({"exact", "fold-strip", "fold-strip-hyphens-rules"})
  public String options;

  private Normaliser normaliser;
  private int next;

  @Setup(Level.Trial)
  public void setUp() {
    switch (options) {
      case "exact":
        normaliser = Normaliser.create(NormalisationOptions.EXACT);
        break;
      case "fold-strip":
        normaliser = Normaliser.create(new NormalisationOptions(true, true, false, false, null));
        break;
      default:
        NormalisationOptions o = new NormalisationOptions(true, true, true, false, Path.of("bench.rules"));
        normaliser = Normaliser.create(o, RulesFile.parse(RULES, o.rulesFile()));
    }
  }

  private String line() {
    next = (next + 1) & 7;
    return LINES[next];
  }

  @Benchmark
  public TokenSequence words() {
    return normaliser.tokens(line(), Unit.WORD);
  }

  @Benchmark
  public TokenSequence chars() {
    return normaliser.tokens(line(), Unit.CHAR);
  }

  @Benchmark
  public List<String> wordList() {
    return normaliser.tokenList(line(), Unit.WORD);
  }
}
