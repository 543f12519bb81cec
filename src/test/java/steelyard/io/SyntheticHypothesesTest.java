package steelyard.io;

import static org.assertj.core.api.Assertions.assertThat;

import java.io.IOException;
import java.nio.file.Files;
import java.nio.file.Path;
import java.util.List;
import org.junit.jupiter.api.Test;
import org.junit.jupiter.api.io.TempDir;

class SyntheticHypothesesTest {
  @TempDir Path dir;

  @Test
  void sameSeedGivesIdenticalBytesAndOtherSeedsDiffer() throws IOException {
    Path a = dir.resolve("a.csv");
    Path b = dir.resolve("b.csv");
    Path c = dir.resolve("c.csv");
    SyntheticHypotheses.write(a, 500, 7, 42L);
    SyntheticHypotheses.write(b, 500, 7, 42L);
    SyntheticHypotheses.write(c, 500, 7, 43L);
    assertThat(Files.readAllBytes(a)).isEqualTo(Files.readAllBytes(b));
    assertThat(Files.readAllBytes(a)).isNotEqualTo(Files.readAllBytes(c));
  }

  @Test
  void writesTheRequestedRowsAsValidContiguousNBestLists() {
    Path f = dir.resolve("syn.csv.gz");
    assertThat(SyntheticHypotheses.write(f, 1003, 20, 5L)).isEqualTo(1003);
    Csv.Log log = new Csv.Log();
    List<UtteranceHypotheses> u = Csv.readHyps(f, log.options("acoustic,lm", null, 0));
    assertThat(u).hasSize(51);
    assertThat(u.subList(0, 50)).allSatisfy(x -> assertThat(x.size()).isEqualTo(20));
    assertThat(u.get(50).size()).isEqualTo(3);
    assertThat(u).allSatisfy(x -> assertThat(x.first().rank()).isEqualTo(1));
    assertThat(log.warnings).isEmpty();
    double tokens = u.stream().flatMap(x -> x.hypotheses().stream()).mapToInt(h -> h.text().split(" ").length).average().orElse(0);
    assertThat(tokens).isBetween(11.0, 19.0);
  }

  @Test
  void formatsTwoDecimalsWithoutLocale() {
    StringBuilder sb = new StringBuilder();
    for (double v : new double[] {-680.014, 3.5, -0.004, 0.0, 12.999}) {
      SyntheticHypotheses.fixed2(sb, v);
      sb.append(' ');
    }
    assertThat(sb.toString()).isEqualTo("-680.01 3.50 0.00 0.00 13.00 ");
  }
}
