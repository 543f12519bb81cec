package steelyard.eval;

import static org.assertj.core.api.Assertions.assertThat;

import java.util.ArrayList;
import java.util.List;
import org.junit.jupiter.api.Test;
import steelyard.io.Hypothesis;
import steelyard.io.UtteranceHypotheses;

class SystemFilterTest {
  private static Hypothesis h(String utt, String system, int rank, String text, int order) {
    return new Hypothesis(utt, system, rank, text, new double[0], "", order, order + 2);
  }

  @Test
  void keepsOneSystemAndPicksItsSmallestRank() {
    UtteranceHypotheses u1 = new UtteranceHypotheses("u1", List.of(
        h("u1", "gray", 2, "b", 0), h("u1", "deskew", 1, "x", 1), h("u1", "gray", 1, "a", 2)), 1);
    UtteranceHypotheses u2 = new UtteranceHypotheses("u2", List.of(h("u2", "deskew", 1, "y", 0)), 0);
    List<UtteranceHypotheses> out = new ArrayList<>();
    new SystemFilter(List.of(u1, u2).iterator(), "gray").forEachRemaining(out::add);
    assertThat(out).hasSize(1);
    assertThat(out.get(0).hypotheses()).extracting(Hypothesis::text).containsExactly("b", "a");
    assertThat(out.get(0).first().text()).isEqualTo("a");
  }
}
