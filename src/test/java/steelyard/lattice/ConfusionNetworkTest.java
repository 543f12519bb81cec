package steelyard.lattice;

import static org.assertj.core.api.Assertions.assertThat;
import static org.assertj.core.api.Assertions.within;

import java.util.Arrays;
import java.util.List;
import java.util.SplittableRandom;
import org.junit.jupiter.api.Nested;
import org.junit.jupiter.api.Test;

class ConfusionNetworkTest {
  private static List<String> words(String s) {
    return s.isEmpty() ? List.of() : Arrays.asList(s.split(" "));
  }

  @Nested
  class Paths {
    @Test
    void everyInputHypothesisIsAPathWithItsOwnTokens() {
      // Invariant of the construction (Mangu, Brill & Stolcke 2000: every hypothesis is a path of its network).
      long seed = 20261202L;
      SplittableRandom rnd = new SplittableRandom(seed);
      for (int u = 0; u < 300; u++) {
        RandomUtterances r = RandomUtterances.draw(rnd, 12, 15, 1 + rnd.nextInt(30), 0.3);
        ConfusionNetwork net = ConfusionNetwork.build(r.hypotheses, r.posteriors, 1000);
        for (int k = 0; k < net.enteredCount(); k++) {
          int input = net.enteredInput(k);
          assertThat(net.pathTokens(k)).as("seed %d utterance %d hypothesis %d", seed, u, input).isEqualTo(r.hypotheses.get(input));
          for (int s = 0; s < net.slotCount(); s++) {
            int a = net.pathArc(k, s);
            assertThat(a).as("seed %d: arc in its slot", seed).isBetween(net.arcStart(s), net.arcEnd(s) - 1);
            assertThat(net.arcHypotheses(a)).as("seed %d: arc lists its hypothesis", seed).contains(input);
          }
        }
      }
    }

    @Test
    void arcPosteriorsAreTheMassOfTheirHypothesesAndSumToOnePerSlot() {
      // Definition of arc posterior (Mangu, Brill & Stolcke 2000, sec. 3): sum over the hypotheses on the arc.
      long seed = 77L;
      SplittableRandom rnd = new SplittableRandom(seed);
      for (int u = 0; u < 200; u++) {
        RandomUtterances r = RandomUtterances.draw(rnd, 8, 12, 1 + rnd.nextInt(20), 0.3);
        ConfusionNetwork net = ConfusionNetwork.build(r.hypotheses, r.posteriors, 1000);
        for (int s = 0; s < net.slotCount(); s++) {
          double slot = 0;
          int hyps = 0;
          for (int a = net.arcStart(s); a < net.arcEnd(s); a++) {
            double mass = 0;
            for (int h : net.arcHypotheses(a)) mass += r.posteriors[h];
            assertThat(net.arcPosterior(a)).as("seed %d", seed).isCloseTo(mass, within(1e-12));
            assertThat(net.arcHypothesisCount(a)).as("seed %d: no arc without hypotheses", seed).isPositive();
            slot += net.arcPosterior(a);
            hyps += net.arcHypothesisCount(a);
          }
          assertThat(slot).as("seed %d", seed).isCloseTo(1.0, within(1e-12));
          assertThat(hyps).as("seed %d: each hypothesis once per slot", seed).isEqualTo(r.hypotheses.size());
        }
      }
    }
  }

  @Test
  void networkOfOneHypothesisIsThatHypothesis() {
    // Worked by hand: one hypothesis gives one slot per token, each with a single arc of posterior 1.
    List<String> h = words("forty crates of plums bay seven");
    ConfusionNetwork net = ConfusionNetwork.build(List.of(h), new double[] {1}, 10);
    assertThat(net.slotCount()).isEqualTo(h.size());
    for (int s = 0; s < net.slotCount(); s++) {
      assertThat(net.arcEnd(s) - net.arcStart(s)).isEqualTo(1);
      assertThat(net.arcText(net.arcStart(s))).isEqualTo(h.get(s));
      assertThat(net.arcPosterior(net.arcStart(s))).isEqualTo(1.0);
    }
    assertThat(Lattices.consensus(List.of(h), new double[] {1}, LatticeSettings.consensusOnly()).tokens()).isEqualTo(h);
  }

  @Test
  void consensusOfIdenticalHypothesesIsThatHypothesis() {
    // Invariant: identical inputs give single-arc slots, so every decision is forced.
    List<String> h = words("load pallet nine to cold store");
    List<List<String>> hyps = List.of(h, h, h, h);
    LatticeChoice c = Lattices.consensus(hyps, new double[] {0.4, 0.3, 0.2, 0.1}, LatticeSettings.consensusOnly());
    assertThat(c.tokens()).isEqualTo(h);
    assertThat(c.sourceHypothesis()).isZero();
    assertThat(c.logPosterior()).isCloseTo(0.0, within(1e-12));
    assertThat(c.isNewTranscript()).isFalse();
  }

  @Test
  void alignsSubstitutionsDeletionsAndInsertionsIntoSlots() {
    // Worked by hand: backbone "ten crates of pears"; "ten crate of pears" substitutes in slot 2;
    // "ten crates pears" leaves slot 3 empty; "ten big crates of pears" inserts a slot before "crates".
    List<List<String>> hyps = List.of(
        words("ten crates of pears"), words("ten crate of pears"), words("ten crates pears"), words("ten big crates of pears"));
    double[] p = {0.4, 0.3, 0.2, 0.1};
    ConfusionNetwork net = ConfusionNetwork.build(hyps, p, 10);
    assertThat(net.slotCount()).isEqualTo(5);
    assertThat(slot(net, 0)).isEqualTo("ten:1.000");
    assertThat(slot(net, 1)).isEqualTo("-:0.900 big:0.100");
    assertThat(slot(net, 2)).isEqualTo("crates:0.700 crate:0.300");
    assertThat(slot(net, 3)).isEqualTo("of:0.800 -:0.200");
    assertThat(slot(net, 4)).isEqualTo("pears:1.000");
    assertThat(Lattices.consensus(hyps, p, LatticeSettings.consensusOnly()).tokens()).isEqualTo(hyps.get(0));
  }

  @Test
  void consensusMayBeATranscriptNoInputContains() {
    // Worked by hand: slot 2 "crates" 0.35+0.25 = 0.6 > "crate" 0.4; slot 3 "plums" 0.4+0.25 = 0.65 > "pears" 0.35.
    List<List<String>> hyps = List.of(words("ten crate plums"), words("ten crates pears"), words("ten crates plums"));
    LatticeChoice c = Lattices.consensus(List.of(hyps.get(0), hyps.get(1)), new double[] {0.4, 0.35}, LatticeSettings.consensusOnly());
    assertThat(c.tokens()).isEqualTo(words("ten crate plums"));
    LatticeChoice d = Lattices.consensus(
        List.of(hyps.get(0), hyps.get(1), words("nine crates plums")), new double[] {0.4, 0.35, 0.25}, LatticeSettings.consensusOnly());
    assertThat(d.tokens()).isEqualTo(words("ten crates plums"));
    assertThat(d.sourceHypothesis()).isEqualTo(-1);
    assertThat(d.logPosterior()).isCloseTo(Math.log(0.75) + Math.log(0.6) + Math.log(0.65), within(1e-12));
  }

  @Test
  void tiesGoToTheEarliestEnteredHypothesis() {
    // Documented rule: equal posteriors enter in input order and the first arc of a slot wins a tie.
    LatticeChoice c = Lattices.consensus(
        List.of(words("six trays"), words("six crates")), new double[] {0.5, 0.5}, LatticeSettings.consensusOnly());
    assertThat(c.tokens()).isEqualTo(words("six trays"));
    LatticeChoice d = Lattices.consensus(
        List.of(words("six crates"), words("six trays")), new double[] {0.5, 0.5}, LatticeSettings.consensusOnly());
    assertThat(d.tokens()).isEqualTo(words("six crates"));
  }

  @Test
  void capKeepsTheHighestPosteriorsAndSaysSo() {
    List<List<String>> hyps = List.of(words("a b"), words("a c"), words("a d"));
    ConfusionNetwork net = ConfusionNetwork.build(hyps, new double[] {0.2, 0.5, 0.3}, 2);
    assertThat(net.capped()).isTrue();
    assertThat(net.enteredCount()).isEqualTo(2);
    assertThat(net.enteredInput(0)).isEqualTo(1);
    assertThat(net.enteredInput(1)).isEqualTo(2);
    assertThat(net.enteredIndexOf(0)).isEqualTo(-1);
    assertThat(slot(net, 1)).isEqualTo("c:0.625 d:0.375"); // renormalised: 0.5/0.8, 0.3/0.8 (by hand)
    assertThat(ConfusionNetwork.build(hyps, new double[] {0.2, 0.5, 0.3}, 3).capped()).isFalse();
  }

  @Test
  void emptyHypothesesAreEmptyPaths() {
    List<List<String>> hyps = List.of(List.of(), words("pears"), List.of());
    ConfusionNetwork net = ConfusionNetwork.build(hyps, new double[] {0.5, 0.3, 0.2}, 10);
    assertThat(net.slotCount()).isEqualTo(1);
    assertThat(slot(net, 0)).isEqualTo("-:0.700 pears:0.300");
    assertThat(net.pathTokens(0)).isEmpty();
    assertThat(Lattices.consensus(hyps, new double[] {0.5, 0.3, 0.2}, LatticeSettings.consensusOnly()).tokens()).isEmpty();
  }

  @Test
  void rejectsPosteriorsThatCannotWeighHypotheses() {
    List<List<String>> hyps = List.of(words("a"), words("b"));
    org.assertj.core.api.Assertions.assertThatIllegalArgumentException()
        .isThrownBy(() -> ConfusionNetwork.build(hyps, new double[] {0.5}, 10)).withMessageContaining("posteriors");
    org.assertj.core.api.Assertions.assertThatIllegalArgumentException()
        .isThrownBy(() -> ConfusionNetwork.build(hyps, new double[] {0.5, -0.1}, 10)).withMessageContaining(">= 0");
    org.assertj.core.api.Assertions.assertThatIllegalArgumentException()
        .isThrownBy(() -> ConfusionNetwork.build(hyps, new double[] {Double.NaN, 1}, 10));
    org.assertj.core.api.Assertions.assertThatIllegalArgumentException()
        .isThrownBy(() -> ConfusionNetwork.build(hyps, new double[] {0, 0}, 10)).withMessageContaining("sum to 0");
    org.assertj.core.api.Assertions.assertThatIllegalArgumentException()
        .isThrownBy(() -> ConfusionNetwork.build(List.of(), new double[0], 10));
  }

  @Test
  void sameInputsGiveTheSameNetwork() {
    long seed = 555L;
    RandomUtterances r = RandomUtterances.draw(new SplittableRandom(seed), 10, 15, 40, 0.3);
    ConfusionNetwork a = ConfusionNetwork.build(r.hypotheses, r.posteriors, 1000);
    ConfusionNetwork b = ConfusionNetwork.build(r.hypotheses, r.posteriors, 1000);
    assertThat(b.slotCount()).as("seed %d", seed).isEqualTo(a.slotCount());
    for (int s = 0; s < a.slotCount(); s++) assertThat(slot(b, s)).as("seed %d", seed).isEqualTo(slot(a, s));
  }

  private static String slot(ConfusionNetwork net, int s) {
    StringBuilder b = new StringBuilder();
    for (int a = net.arcStart(s); a < net.arcEnd(s); a++) {
      if (b.length() > 0) b.append(' ');
      b.append(net.isEmpty(a) ? "-" : net.arcText(a)).append(':').append(String.format(java.util.Locale.ROOT, "%.3f", net.arcPosterior(a)));
    }
    return b.toString();
  }
}
