package steelyard.lattice;

import static org.assertj.core.api.Assertions.assertThat;

import java.util.Arrays;
import java.util.List;
import java.util.SplittableRandom;
import org.junit.jupiter.api.Test;

class LatticeOracleTest {
  private static List<String> words(String s) {
    return Arrays.asList(s.split(" "));
  }

  @Test
  void latticeOracleIsAtMostNBestOracleWhichIsAtMostFirst() {
    // Invariant: every hypothesis is a path, so the best path is no worse than the best hypothesis, which is
    // no worse than the first. N-best errors come from the test's own edit distance.
    long seed = 4242L;
    SplittableRandom rnd = new SplittableRandom(seed);
    int strictlyBetter = 0;
    for (int u = 0; u < 300; u++) {
      RandomUtterances r = RandomUtterances.draw(rnd, 10, 15, 2 + rnd.nextInt(20), 0.3);
      int first = RandomUtterances.editDistance(r.reference, r.hypotheses.get(0));
      int nbest = Integer.MAX_VALUE;
      for (List<String> h : r.hypotheses) nbest = Math.min(nbest, RandomUtterances.editDistance(r.reference, h));
      ConfusionNetwork net = ConfusionNetwork.build(r.hypotheses, r.posteriors, 1000);
      OraclePath oracle = Lattices.oracle(net, r.reference);
      assertThat(oracle.errors()).as("seed %d utterance %d", seed, u).isLessThanOrEqualTo(nbest);
      assertThat(nbest).as("seed %d utterance %d", seed, u).isLessThanOrEqualTo(first);
      assertThat(RandomUtterances.editDistance(r.reference, oracle.tokens()))
          .as("seed %d utterance %d: the oracle path really has that many errors", seed, u).isEqualTo(oracle.errors());
      assertThat(Lattices.oracleErrors(r.hypotheses, r.posteriors, r.reference, LatticeSettings.consensusOnly()))
          .isEqualTo(oracle.errors());
      if (oracle.errors() < nbest) strictlyBetter++;
    }
    assertThat(strictlyBetter).as("seed %d: the network combines hypotheses at least sometimes", seed).isPositive();
  }

  @Test
  void oracleCombinesCorrectPiecesOfDifferentHypotheses() {
    // Worked by hand: each hypothesis has one error, in different slots; the network holds the reference.
    List<List<String>> hyps = List.of(words("twelve crates of pairs"), words("twelve grates of pears"));
    List<String> ref = words("twelve crates of pears");
    OraclePath o = Lattices.oracle(ConfusionNetwork.build(hyps, new double[] {0.6, 0.4}, 10), ref);
    assertThat(o.errors()).isZero();
    assertThat(o.tokens()).isEqualTo(ref);
  }

  @Test
  void oracleCountsDeletionsAndInsertionsAgainstTheReference() {
    // Worked by hand: the only paths are "six crates" and "six"; reference "six big crates plums":
    // best is "six crates" with two deletions (big, plums).
    List<List<String>> hyps = List.of(words("six crates"), words("six"));
    assertThat(Lattices.oracle(ConfusionNetwork.build(hyps, new double[] {0.5, 0.5}, 10), words("six big crates plums")).errors())
        .isEqualTo(2);
    // Reference shorter than every path: "crates" alone → "six" is an insertion in the best path "six"?
    // Paths "six crates" (1 insertion) and "six" (1 substitution): 1.
    assertThat(Lattices.oracle(ConfusionNetwork.build(hyps, new double[] {0.5, 0.5}, 10), words("crates")).errors()).isEqualTo(1);
  }
}
