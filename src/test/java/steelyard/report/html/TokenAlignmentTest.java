package steelyard.report.html;

import static org.assertj.core.api.Assertions.assertThat;

import java.util.ArrayList;
import java.util.List;
import java.util.SplittableRandom;
import org.apache.commons.text.similarity.LevenshteinDistance;
import org.junit.jupiter.api.Test;
import steelyard.eval.Aligner;
import steelyard.eval.EditCounts;
import steelyard.report.html.ReportModel.AlignedText;
import steelyard.report.html.ReportModel.AlignedToken;
import steelyard.report.html.ReportModel.Op;

/** The displayed alignment agrees with the scorer's counts and with an independent edit distance. */
class TokenAlignmentTest {
  private static final long SEED = 20261202L;
  private static final String[] WORDS = {"bay", "day", "nine", "pallet", "palate", "of", "pears", "pairs", "to", "uh"};

  @Test
  void errorCountIsTheEditDistanceOfAnIndependentLibraryOnRandomPairs() {
    SplittableRandom rnd = new SplittableRandom(SEED);
    TokenAlignment alignment = new TokenAlignment();
    for (int trial = 0; trial < 2000; trial++) {
      List<String> ref = randomWords(rnd);
      List<String> hyp = randomWords(rnd);
      AlignedText text = alignment.align(String.join(" ", hyp), ref, hyp);
      // commons-text LevenshteinDistance (unit costs) over one character per word.
      int expected = LevenshteinDistance.getDefaultInstance().apply(code(ref), code(hyp));
      assertThat(text.errors()).as("seed %d trial %d: %s vs %s", SEED, trial, ref, hyp).isEqualTo(expected);
    }
  }

  @Test
  void operationCountsMatchTheScorersCountsOnRandomPairs() {
    SplittableRandom rnd = new SplittableRandom(SEED + 1);
    TokenAlignment alignment = new TokenAlignment();
    Aligner aligner = new Aligner();
    for (int trial = 0; trial < 2000; trial++) {
      List<String> ref = randomWords(rnd);
      List<String> hyp = randomWords(rnd);
      List<AlignedToken> steps = alignment.steps(ref, hyp);
      EditCounts counts = aligner.count(ids(ref), ids(hyp));
      assertThat(new long[] {n(steps, Op.MATCH), n(steps, Op.SUBSTITUTION), n(steps, Op.DELETION), n(steps, Op.INSERTION)})
          .as("seed %d trial %d", SEED + 1, trial)
          .containsExactly(counts.correct(), counts.substitutions(), counts.deletions(), counts.insertions());
    }
  }

  @Test
  void stepsSpellOutBothSequencesInOrder() {
    SplittableRandom rnd = new SplittableRandom(SEED + 2);
    TokenAlignment alignment = new TokenAlignment();
    for (int trial = 0; trial < 500; trial++) {
      List<String> ref = randomWords(rnd);
      List<String> hyp = randomWords(rnd);
      List<String> r = new ArrayList<>();
      List<String> h = new ArrayList<>();
      for (AlignedToken t : alignment.steps(ref, hyp)) {
        if (t.reference() != null) r.add(t.reference());
        if (t.hypothesis() != null) h.add(t.hypothesis());
        assertThat(t.op() == Op.MATCH).isEqualTo(t.reference() != null && t.reference().equals(t.hypothesis()));
      }
      assertThat(r).isEqualTo(ref);
      assertThat(h).isEqualTo(hyp);
    }
  }

  @Test
  void workedExample() {
    // pallet of pears to bay nine / palate of pairs to day nine: three substitutions, by hand.
    List<AlignedToken> steps = new TokenAlignment().steps(SampleReports.words("pallet of pears to bay nine"),
        SampleReports.words("palate of pairs to day nine"));
    assertThat(steps.stream().map(AlignedToken::op)).containsExactly(Op.SUBSTITUTION, Op.MATCH, Op.SUBSTITUTION, Op.MATCH,
        Op.SUBSTITUTION, Op.MATCH);
  }

  private static List<String> randomWords(SplittableRandom rnd) {
    int n = rnd.nextInt(0, 9);
    List<String> out = new ArrayList<>(n);
    for (int k = 0; k < n; k++) out.add(WORDS[rnd.nextInt(WORDS.length)]);
    return out;
  }

  private static String code(List<String> words) {
    StringBuilder sb = new StringBuilder();
    for (String w : words) sb.append((char) ('a' + List.of(WORDS).indexOf(w)));
    return sb.toString();
  }

  private static int[] ids(List<String> words) {
    return words.stream().mapToInt(w -> List.of(WORDS).indexOf(w)).toArray();
  }

  private static long n(List<AlignedToken> steps, Op op) {
    return steps.stream().filter(t -> t.op() == op).count();
  }
}
