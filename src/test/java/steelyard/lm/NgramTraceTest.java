package steelyard.lm;

import static org.assertj.core.api.Assertions.assertThat;
import static org.assertj.core.api.Assertions.within;

import java.nio.file.Path;
import java.util.ArrayList;
import java.util.Arrays;
import java.util.List;
import java.util.SplittableRandom;
import java.util.function.Function;
import java.util.stream.Stream;
import org.junit.jupiter.api.Test;
import org.junit.jupiter.params.ParameterizedTest;
import org.junit.jupiter.params.provider.Arguments;
import org.junit.jupiter.params.provider.MethodSource;

/**
 * Per-prediction log-probabilities and matched n-gram orders. The hand-worked values follow the back-off rule
 * of the ARPA format (Katz 1987, as ARPA files store it): P(w|h) = P*(h w) when h w is listed, else
 * bow(h)·P(w|h′), bow(h) = 1 when h is not listed; the matched order is the length of the listed n-gram whose
 * own probability was used. Model: the hand-written {@code lm/warehouse.arpa} (3-gram; "bay crates" is only the
 * context of the listed "bay crates apples").
 */
class NgramTraceTest {
  static final double LN10 = Math.log(10);

  static Stream<Arguments> engines() {
    return Stream.of(
        Arguments.of("exact", (Function<Path, LanguageModel>) p -> ModelFiles.loadExact(p, ArpaSemanticsTest.quiet())),
        Arguments.of("compact", (Function<Path, LanguageModel>) p -> ModelFiles.load(p, ArpaSemanticsTest.quiet())));
  }

  private static NgramTrace trace(Function<Path, LanguageModel> load, Path file, String... words) {
    return NgramTrace.of(load.apply(file), List.of(words));
  }

  @ParameterizedTest(name = "[{index}] {0}")
  @MethodSource("engines")
  void listedNgramsAreMatchedAtTheirOwnOrder(String name, Function<Path, LanguageModel> load) {
    NgramTrace t = trace(load, ArpaSemanticsTest.WAREHOUSE, "crates", "apples");
    // P(crates | <s>) listed (-0.40); P(apples | <s> crates) listed (-0.10);
    // P(</s> | crates apples) = bow(crates apples) -0.15 + bow(apples) -0.20 + P(</s>) -0.70
    assertThat(orders(t)).containsExactly(2, 3, 1);
    assertThat(t.logProb(0)).isCloseTo(-0.40 * LN10, within(1e-6));
    assertThat(t.logProb(1)).isCloseTo(-0.10 * LN10, within(1e-6));
    assertThat(t.logProb(2)).isCloseTo(-1.05 * LN10, within(1e-6));
    assertThat(t.ngram(1)).containsExactly("<s>", "crates", "apples");
    assertThat(t.ngram(2)).containsExactly("</s>");
  }

  @ParameterizedTest(name = "[{index}] {0}")
  @MethodSource("engines")
  void aContextOnlyEntryIsBackedOffFromButKeepsTheLongerContext(String name, Function<Path, LanguageModel> load) {
    NgramTrace t = trace(load, ArpaSemanticsTest.WAREHOUSE, "bay", "crates", "apples");
    // bay | <s>: "<s> bay" not listed → bow(<s>) -0.30 + P(bay) -1.2 (order 1)
    // crates | bay: "bay crates" is a context only (no probability), bay has no back-off → P(crates) -0.90 (order 1)
    // apples | bay crates: listed trigram -0.05 (order 3)
    assertThat(orders(t)).containsExactly(1, 1, 3, 1);
    assertThat(t.logProb(0)).isCloseTo(-1.50 * LN10, within(1e-6));
    assertThat(t.logProb(1)).isCloseTo(-0.90 * LN10, within(1e-6));
    assertThat(t.logProb(2)).isCloseTo(-0.05 * LN10, within(1e-6));
    assertThat(t.ngram(2)).containsExactly("bay", "crates", "apples");
  }

  @ParameterizedTest(name = "[{index}] {0}")
  @MethodSource("engines")
  void anUnknownWordIsMatchedAsTheUnkUnigram(String name, Function<Path, LanguageModel> load) {
    NgramTrace t = trace(load, ArpaSemanticsTest.WAREHOUSE, "crates", "pumpkins");
    // pumpkins | <s> crates = bow(<s> crates) -0.25 + bow(crates) -0.10 + P(<unk>) -2.00
    assertThat(t.matchedOrder(1)).isEqualTo(1);
    assertThat(t.logProb(1)).isCloseTo(-2.35 * LN10, within(1e-6));
    assertThat(t.token(1)).isEqualTo("pumpkins");
    assertThat(t.ngram(1)).containsExactly("pumpkins");
  }

  @ParameterizedTest(name = "[{index}] {0}")
  @MethodSource("engines")
  void anUnknownWordOfAClosedVocabularyIsMatchedByNoNgram(String name, Function<Path, LanguageModel> load) {
    NgramTrace t = trace(load, ArpaSemanticsTest.CLOSED, "pumpkins");
    // closed.arpa has no <unk>: the floor (-7 as loaded here) plus bow(<s>) -0.30; no n-gram decided it
    assertThat(t.matchedOrder(0)).isEqualTo(0);
    assertThat(t.logProb(0)).isCloseTo(-7.30 * LN10, within(1e-6));
    assertThat(t.ngram(0)).containsExactly("pumpkins");
  }

  /** A mixture has no single back-off path: it reports the longest n-gram any weighted component listed. */
  @Test
  void aMixtureReportsTheLongestOrderOfItsComponents() {
    LanguageModel a = ModelFiles.loadExact(ArpaSemanticsTest.WAREHOUSE, ArpaSemanticsTest.quiet());
    BackoffModel.Builder b = new BackoffModel.Builder(1, a.unit(), a.normalisation());
    b.add(new int[] {b.tokenId("<s>")}, -99, 0);
    b.add(new int[] {b.tokenId("</s>")}, -0.5, 0);
    b.add(new int[] {b.tokenId("<unk>")}, -1.0, 0);
    b.add(new int[] {b.tokenId("apples")}, -0.4, 0);
    b.add(new int[] {b.tokenId("crates")}, -0.6, 0);
    BackoffModel unigrams = b.build();
    MixtureModel mix = new MixtureModel(List.of(a, unigrams), new double[] {0.5, 0.5});
    NgramTrace t = NgramTrace.of(mix, List.of("crates", "apples"));
    assertThat(orders(t)).containsExactly(2, 3, 1);
    double p = 0.5 * Math.pow(10, -0.10) + 0.5 * Math.pow(10, -0.4); // exact interpolation, P(apples | <s> crates)
    assertThat(t.logProb(1)).isCloseTo(Math.log(p), within(1e-9));
    MixtureModel onlyUnigrams = new MixtureModel(List.of(a, unigrams), new double[] {0, 1});
    assertThat(orders(NgramTrace.of(onlyUnigrams, List.of("crates", "apples")))).containsExactly(1, 1, 1);
  }

  /**
   * Random suffix-closed models (as the usual estimators write them): the trace's total is the sentence's ln P
   * to the last bit, both engines report the same orders, and each order equals a brute-force search for the
   * longest listed n-gram ending in the token (the ARPA rule), on sentences with unknown words.
   */
  @Test
  void ordersMatchTheLongestListedNgramOnRandomModels() {
    long seed = 20261203L;
    SplittableRandom rnd = new SplittableRandom(seed);
    for (int m = 0; m < 30; m++) {
      int order = 2 + rnd.nextInt(4);
      BackoffModel exact = RandomModels.model(rnd, order, 12, 40, rnd.nextBoolean(), true);
      CompactModel compact = CompactModel.of(exact);
      for (int s = 0; s < 20; s++) {
        List<String> words = Arrays.asList(RandomModels.sentence(rnd, 12, rnd.nextInt(12)));
        NgramTrace te = NgramTrace.of(exact, words);
        NgramTrace tc = NgramTrace.of(compact, words);
        assertThat(te.total()).as("seed %d", seed).isEqualTo(exact.sentenceLogProb(words));
        assertThat(tc.total()).as("seed %d", seed).isEqualTo(compact.sentenceLogProb(words));
        assertThat(orders(tc)).as("seed %d", seed).isEqualTo(orders(te));
        for (int k = 0; k < te.size(); k++)
          assertThat(te.matchedOrder(k)).as("seed %d, %s at %d", seed, words, k).isEqualTo(longestListed(exact, te, k));
      }
    }
  }

  /** Brute force: the longest n-gram (at most the model's order) of {@code <s>} + the sentence ending at k that is listed. */
  private static int longestListed(BackoffModel lm, NgramTrace t, int k) {
    List<Integer> ids = new ArrayList<>();
    ids.add(lm.sentenceStartId());
    for (int j = 0; j <= k; j++) ids.add(t.id(j));
    for (int n = Math.min(lm.order(), ids.size()); n >= 1; n--) {
      int[] g = ids.subList(ids.size() - n, ids.size()).stream().mapToInt(Integer::intValue).toArray();
      int e = lm.entryIndex(g);
      if (e >= 0 && !Double.isNaN(lm.log10Prob(n, e))) return n;
    }
    return t.id(k) != lm.unknownId() && lm.hasUnknownUnigram() ? 1 : 0;
  }

  private static List<Integer> orders(NgramTrace t) {
    List<Integer> o = new ArrayList<>();
    for (int k = 0; k < t.size(); k++) o.add(t.matchedOrder(k));
    return o;
  }
}
