package steelyard.lattice;

import static org.assertj.core.api.Assertions.assertThat;
import static org.assertj.core.api.Assertions.within;

import java.util.ArrayList;
import java.util.Arrays;
import java.util.Comparator;
import java.util.HashMap;
import java.util.List;
import java.util.Map;
import java.util.SplittableRandom;
import org.junit.jupiter.api.Test;
import steelyard.lm.BackoffModel;

class LatticeSearchTest {
  private static final int EXACT = Integer.MAX_VALUE;

  private static List<String> words(String s) {
    return Arrays.asList(s.split(" "));
  }

  private static List<String> vocab(int n) {
    List<String> v = new ArrayList<>();
    for (int i = 0; i < n; i++) v.add("w" + i);
    return v;
  }

  @Test
  void withZeroLmWeightTheSearchIsConsensusDecoding() {
    // Definition (Mangu, Brill & Stolcke 2000): with no LM term the path score is a sum of independent
    // per-slot terms, so the best path takes the best arc of every slot. Also run with a negligible λ′ so
    // that the LM-state search itself is exercised.
    long seed = 99L;
    SplittableRandom rnd = new SplittableRandom(seed);
    BackoffModel lm = NaiveBackoffLm.random(rnd, vocab(10), 3, 200).model();
    for (int u = 0; u < 200; u++) {
      RandomUtterances r = RandomUtterances.draw(rnd, 10, 15, 1 + rnd.nextInt(30), 0.3);
      LatticeChoice consensus = Lattices.consensus(r.hypotheses, r.posteriors, LatticeSettings.consensusOnly());
      LatticeChoice zero = Lattices.search(r.hypotheses, r.posteriors, null, LatticeSettings.consensusOnly());
      LatticeChoice tiny = Lattices.search(r.hypotheses, r.posteriors, lm, new LatticeSettings(1e-15, 0, 64, 200));
      assertThat(zero.tokens()).as("seed %d utterance %d", seed, u).isEqualTo(consensus.tokens());
      assertThat(zero.score()).as("seed %d utterance %d", seed, u).isCloseTo(consensus.logPosterior(), within(1e-9));
      assertThat(tiny.tokens()).as("seed %d utterance %d", seed, u).isEqualTo(consensus.tokens());
      assertThat(zero.sourceHypothesis()).isEqualTo(consensus.sourceHypothesis());
    }
  }

  @Test
  void followsAModelThatStronglyPrefersOneOfTwoArcs() {
    // Worked by hand: slot 3 is "pears" 0.6 / "plums" 0.4; the model gives P(plums | of) ≈ 1 and
    // P(pears | of) = 1e-6 (log10 −6), so with λ′ = 1 the search must take "plums".
    NaiveBackoffLm n = new NaiveBackoffLm(2);
    n.add(-99, 0, "<s>");
    n.add(-1, 0, "</s>");
    n.add(-3, 0, "<unk>");
    for (String w : words("crates of pears plums")) n.add(-1, 0, w);
    n.add(-0.0001, 0, "of", "plums");
    n.add(-6, 0, "of", "pears");
    BackoffModel lm = n.model();
    List<List<String>> hyps = List.of(words("crates of pears"), words("crates of plums"));
    double[] p = {0.6, 0.4};
    assertThat(Lattices.search(hyps, p, lm, new LatticeSettings(0, 0, 64, 10)).tokens()).isEqualTo(hyps.get(0));
    LatticeChoice c = Lattices.search(hyps, p, lm, new LatticeSettings(1, 0, 64, 10));
    assertThat(c.tokens()).isEqualTo(hyps.get(1));
    assertThat(c.sourceHypothesis()).isEqualTo(1);
  }

  @Test
  void marksAPathNoInputContainsAsNew() {
    // Worked by hand: "ten crates" (0.6) / "two boxes" (0.4); the model only likes "ten boxes".
    NaiveBackoffLm n = new NaiveBackoffLm(2);
    n.add(-99, 0, "<s>");
    n.add(-1, 0, "</s>");
    n.add(-3, 0, "<unk>");
    for (String w : words("ten two crates boxes")) n.add(-2, 0, w);
    n.add(-0.01, 0, "ten", "boxes");
    n.add(-0.01, 0, "<s>", "ten");
    LatticeChoice c = Lattices.search(List.of(words("ten crates"), words("two boxes")), new double[] {0.6, 0.4}, n.model(),
        new LatticeSettings(1, 0, 64, 10));
    assertThat(c.tokens()).isEqualTo(words("ten boxes"));
    assertThat(c.sourceHypothesis()).isEqualTo(-1);
    assertThat(c.isNewTranscript()).isTrue();
  }

  @Test
  void scoreOfThePathEqualsAReferenceScoringOfItsText() {
    // Reference: the test's own map-based back-off scorer (ARPA rule) for the LM term, plus Σ ln posterior
    // computed here from the hypotheses (equal lengths, position-specific words: slot i holds the words at
    // position i, arc posterior = mass of the hypotheses with that word there), plus μ′ per token.
    long seed = 31337L;
    SplittableRandom rnd = new SplittableRandom(seed);
    int len = 6;
    List<String> vocab = new ArrayList<>();
    for (int i = 0; i < len; i++) for (int x = 0; x < 4; x++) vocab.add("p" + i + "x" + x);
    for (int u = 0; u < 100; u++) {
      NaiveBackoffLm naive = NaiveBackoffLm.random(rnd, vocab, 3, 150);
      BackoffModel lm = naive.model();
      int nh = 2 + rnd.nextInt(10);
      List<List<String>> hyps = new ArrayList<>();
      double[] p = new double[nh];
      double sum = 0;
      for (int h = 0; h < nh; h++) {
        List<String> hyp = new ArrayList<>();
        for (int i = 0; i < len; i++) hyp.add("p" + i + "x" + rnd.nextInt(4));
        hyps.add(hyp);
        sum += p[h] = 0.1 + rnd.nextDouble();
      }
      for (int h = 0; h < nh; h++) p[h] /= sum;
      double lambda = 0.5 + 3 * rnd.nextDouble();
      double mu = rnd.nextDouble() - 0.5;
      for (LatticeChoice c : Lattices.searchKBest(hyps, p, lm, new LatticeSettings(lambda, mu, EXACT, 100), 5)) {
        double logPost = 0;
        for (int i = 0; i < len; i++) {
          double mass = 0;
          for (int h = 0; h < nh; h++) if (hyps.get(h).get(i).equals(c.tokens().get(i))) mass += p[h];
          logPost += Math.log(mass);
        }
        double lmLn = naive.sentenceLn(c.tokens());
        assertThat(c.lmLogProb()).as("seed %d utterance %d", seed, u).isCloseTo(lmLn, within(1e-9));
        assertThat(c.logPosterior()).as("seed %d utterance %d", seed, u).isCloseTo(logPost, within(1e-9));
        assertThat(c.score()).as("seed %d utterance %d", seed, u).isCloseTo(logPost + lambda * lmLn + mu * len, within(1e-9));
        assertThat(c.tokenCount()).isEqualTo(len);
      }
    }
  }

  @Test
  void exactKBestEqualsExhaustiveEnumerationOfDistinctTexts() {
    // Reference: enumerate every path of small networks, score with the test's own back-off scorer,
    // keep the best score per distinct text, sort; the exact search's k best must match it.
    long seed = 8080L;
    SplittableRandom rnd = new SplittableRandom(seed);
    List<String> vocab = vocab(6);
    for (int u = 0; u < 150; u++) {
      NaiveBackoffLm naive = NaiveBackoffLm.random(rnd, vocab, 3, 80);
      RandomUtterances r = RandomUtterances.draw(rnd, 6, 6, 2 + rnd.nextInt(6), 0.4);
      ConfusionNetwork net = ConfusionNetwork.build(r.hypotheses, r.posteriors, 100);
      double lambda = 2 * rnd.nextDouble();
      double mu = rnd.nextDouble() - 0.5;
      Map<List<String>, Double> best = new HashMap<>();
      enumerate(net, 0, new ArrayList<>(), 0, naive, lambda, mu, best);
      List<Map.Entry<List<String>, Double>> expected = new ArrayList<>(best.entrySet());
      expected.sort(Map.Entry.<List<String>, Double>comparingByValue(Comparator.reverseOrder()));
      int k = 1 + rnd.nextInt(6);
      List<LatticeChoice> got = Lattices.searchKBest(net, r.hypotheses, r.posteriors, naive.model(), new LatticeSettings(lambda, mu, EXACT, 100), k);
      assertThat(got).as("seed %d utterance %d", seed, u).hasSize(Math.min(k, expected.size()));
      for (int i = 0; i < got.size(); i++) {
        assertThat(got.get(i).score()).as("seed %d utterance %d rank %d", seed, u, i).isCloseTo(expected.get(i).getValue(), within(1e-9));
        assertThat(best.get(got.get(i).tokens())).as("seed %d utterance %d rank %d", seed, u, i).isCloseTo(got.get(i).score(), within(1e-9));
      }
      assertThat(got.stream().map(LatticeChoice::tokens).distinct().count()).isEqualTo(got.size());
    }
  }

  private static void enumerate(ConfusionNetwork net, int slot, List<String> text, double logPost, NaiveBackoffLm lm,
      double lambda, double mu, Map<List<String>, Double> best) {
    if (slot == net.slotCount()) {
      double score = logPost + lambda * lm.sentenceLn(text) + mu * text.size();
      best.merge(List.copyOf(text), score, Math::max);
      return;
    }
    for (int a = net.arcStart(slot); a < net.arcEnd(slot); a++) {
      if (!net.isEmpty(a)) text.add(net.arcText(a));
      enumerate(net, slot + 1, text, logPost + Math.log(net.arcPosterior(a)), lm, lambda, mu, best);
      if (!net.isEmpty(a)) text.remove(text.size() - 1);
    }
  }

  @Test
  void defaultBeamRarelyMissesTheExactBest() {
    // A search error: the beam's best scores below the exact best (unbounded beam, exact because equal LM
    // states recombine). Issue target ≤ 1 % of utterances; the benchmark measures it on 100-best lists.
    long seed = 2718L;
    SplittableRandom rnd = new SplittableRandom(seed);
    List<String> vocab = vocab(30);
    BackoffModel lm = NaiveBackoffLm.random(rnd, vocab, 3, 3000).model();
    int errors = 0;
    int utterances = 200;
    for (int u = 0; u < utterances; u++) {
      RandomUtterances r = RandomUtterances.draw(rnd, 30, 15, 30, 0.25);
      ConfusionNetwork net = ConfusionNetwork.build(r.hypotheses, r.posteriors, 200);
      LatticeSettings beam = new LatticeSettings(1, 0, LatticeSettings.DEFAULT_BEAM, 200);
      LatticeSettings exact = new LatticeSettings(1, 0, EXACT, 200);
      double b = Lattices.searchKBest(net, r.hypotheses, r.posteriors, lm, beam, 1).get(0).score();
      double e = Lattices.searchKBest(net, r.hypotheses, r.posteriors, lm, exact, 1).get(0).score();
      assertThat(b).as("seed %d: the beam never beats the exact search", seed).isLessThanOrEqualTo(e + 1e-9);
      if (b < e - 1e-9) errors++;
    }
    assertThat(errors).as("seed %d: search errors of %d utterances", seed, utterances).isLessThanOrEqualTo(utterances / 100);
  }

  @Test
  void boundPruningKeepsExactlyTheStatesThePlainBeamKeeps() {
    // Invariant of the bound (see Layer.bound): for k = 1 skipping paths below the running lower bound on
    // the beam-th state score changes nothing. The k = 2 search does not use the bound, and its best path
    // is decided by the same per-state best scores, so both must agree at every beam.
    long seed = 1234L;
    SplittableRandom rnd = new SplittableRandom(seed);
    BackoffModel lm = NaiveBackoffLm.random(rnd, vocab(20), 3, 1500).model();
    for (int u = 0; u < 150; u++) {
      RandomUtterances r = RandomUtterances.draw(rnd, 20, 15, 20, 0.3);
      ConfusionNetwork net = ConfusionNetwork.build(r.hypotheses, r.posteriors, 200);
      LatticeSettings s = new LatticeSettings(0.5 + rnd.nextDouble() * 2, rnd.nextDouble() - 0.5, 1 + rnd.nextInt(8), 200);
      double one = Lattices.searchKBest(net, r.hypotheses, r.posteriors, lm, s, 1).get(0).score();
      double two = Lattices.searchKBest(net, r.hypotheses, r.posteriors, lm, s, 2).get(0).score();
      assertThat(one).as("seed %d utterance %d %s", seed, u, s).isCloseTo(two, within(1e-9));
    }
  }

  @Test
  void aBeamOfOneStillReturnsAPathAndSaysItWasLimited() {
    long seed = 5L;
    SplittableRandom rnd = new SplittableRandom(seed);
    BackoffModel lm = NaiveBackoffLm.random(rnd, vocab(10), 3, 200).model();
    RandomUtterances r = RandomUtterances.draw(rnd, 10, 15, 20, 0.4);
    LatticeChoice c = Lattices.search(r.hypotheses, r.posteriors, lm, new LatticeSettings(1, 0, 1, 200));
    assertThat(c.capped()).isTrue();
    assertThat(c.score()).isFinite();
  }
}
