package steelyard.eval;

import static org.assertj.core.api.Assertions.assertThat;

import java.util.HashMap;
import java.util.Map;
import java.util.SplittableRandom;
import org.apache.commons.text.similarity.LevenshteinDistance;
import org.junit.jupiter.api.Nested;
import org.junit.jupiter.api.Test;
import org.junit.jupiter.params.ParameterizedTest;
import org.junit.jupiter.params.provider.CsvSource;

class AlignerTest {
  private final Aligner aligner = new Aligner();
  private final Map<String, Integer> vocab = new HashMap<>();

  private int[] words(String text) {
    if (text.isBlank()) return new int[0];
    String[] w = text.trim().split("\\s+");
    int[] ids = new int[w.length];
    for (int i = 0; i < w.length; i++) ids[i] = vocab.computeIfAbsent(w[i], k -> vocab.size());
    return ids;
  }

  static int[] randomSeq(SplittableRandom rnd, int maxLen, int alphabet) {
    int[] s = new int[rnd.nextInt(maxLen + 1)];
    for (int i = 0; i < s.length; i++) s[i] = rnd.nextInt(alphabet);
    return s;
  }

  /** One BMP code point per token id (CJK block: no surrogates), so string edit distance = token edit distance. */
  static String asCodePoints(int[] ids) {
    StringBuilder sb = new StringBuilder(ids.length);
    for (int id : ids) sb.appendCodePoint(0x4E00 + id);
    return sb.toString();
  }

  @Nested
  class AgainstReferenceLibrary {
    // Source: commons-text LevenshteinDistance (reference library, test scope), unit-cost edit distance.
    @Test
    void distanceEqualsCommonsTextLevenshteinOnRandomSequences() {
      LevenshteinDistance reference = LevenshteinDistance.getDefaultInstance();
      long seed = 0x5EED_A11L;
      SplittableRandom rnd = new SplittableRandom(seed);
      for (int trial = 0; trial < 5000; trial++) {
        int alphabet = 1 + rnd.nextInt(trial % 3 == 0 ? 3 : 40);
        int maxLen = trial % 10 == 0 ? 90 : 25;
        int[] ref = randomSeq(rnd, maxLen, alphabet);
        int[] hyp = randomSeq(rnd, maxLen, alphabet);
        int expected = reference.apply(asCodePoints(ref), asCodePoints(hyp));
        String msg = "seed " + seed + " trial " + trial;
        assertThat(aligner.distance(ref, hyp)).as(msg).isEqualTo(expected);
        assertThat(aligner.count(ref, hyp).errors()).as(msg).isEqualTo(expected);
        assertThat(aligner.alignment(ref, hyp).counts().errors()).as(msg).isEqualTo(expected);
      }
    }
  }

  @Nested
  class WorkedByHand {
    // All expected counts in this class are worked by hand from the unit-cost definition of edit distance.
    @ParameterizedTest(name = "[{index}] {arguments}")
    @CsvSource(
        delimiter = '|',
        value = {
          // ref                     | hyp                          | C | S | D | I
          "load the pallet            | load the pallet             | 3 | 0 | 0 | 0",
          "load the pallet            | load a pallet               | 2 | 1 | 0 | 0",
          "load the red pallet        | load the pallet             | 3 | 0 | 1 | 0",
          "load pallet                | load the pallet             | 2 | 0 | 0 | 1",
          "''                         | two crates                  | 0 | 0 | 0 | 2",
          "two crates                 | ''                          | 0 | 0 | 2 | 0",
          "bay four cold store        | bay for cold store door     | 3 | 1 | 0 | 1",
          "ship six crates of pears   | ship crates of bears today  | 3 | 1 | 1 | 1",
        })
    void countsMatchHandWorkedAlignment(String ref, String hyp, long c, long s, long d, long i) {
      assertThat(aligner.count(words(ref), words(hyp))).isEqualTo(new EditCounts(c, s, d, i));
      assertThat(aligner.alignment(words(ref), words(hyp)).counts()).isEqualTo(new EditCounts(c, s, d, i));
    }

    @Test
    void prefersSubstitutionOverDeletionWalkingBackFromTheEnd() {
      // Worked by hand. ref = a b, hyp = c. Cost table (rows: ref prefix, columns: hyp prefix):
      //        ""  c
      //   ""    0  1
      //   a     1  1
      //   b     2  2
      // From (2,1): diagonal b~c costs table(1,0)+1 = 2 = table(2,1), taken first: S(b,c); then (1,0): D(a).
      // (The other optimum, S(a,c) then D(b), is not chosen.)
      Alignment al = aligner.alignment(words("a b"), words("c"));
      assertThat(al.toString()).isEqualTo("D S");
      assertThat(al.refIndex(1)).isEqualTo(1);
      assertThat(al.hypIndex(1)).isZero();
      assertThat(al.hypIndex(0)).isEqualTo(-1);
    }

    @Test
    void prefersTwoSubstitutionsOverDeletionPlusInsertion() {
      // Worked by hand. ref = a b, hyp = b a: optimal cost 2 by S S, by D C I or by I C D.
      // From (2,2): diagonal b~a costs table(1,1)+1 = 1+1 = 2 = table(2,2): S; then (1,1): a~b: S.
      assertThat(aligner.alignment(words("a b"), words("b a")).toString()).isEqualTo("S S");
      assertThat(aligner.count(words("a b"), words("b a"))).isEqualTo(new EditCounts(0, 2, 0, 0));
    }

    @Test
    void prefersDeletionOverInsertionWhenDiagonalIsWorse() {
      // Worked by hand. ref = x a, hyp = a y. Table:
      //        ""  a  y
      //   ""    0  1  2
      //   x     1  1  2
      //   a     2  1  2
      // From (2,2): diagonal a~y: table(1,1)+1 = 2 = table(2,2): S(a,y); from (1,1): x~a: S. Result S S
      // (the alternative D(x) C(a) I(y) has the same cost 2 and loses the tie).
      assertThat(aligner.alignment(words("x a"), words("a y")).toString()).isEqualTo("S S");
      // ref = a b c, hyp = c: from (3,1) diagonal c~c: table(2,0)+0 = 2 = table(3,1): C; then D D.
      assertThat(aligner.alignment(words("a b c"), words("c")).toString()).isEqualTo("D D C");
      // ref = c, hyp = c a b: from (1,3): diagonal c~b costs table(0,2)+1 = 3 > 2; up: table(0,3)+1 = 4;
      // left: table(1,2)+1 = 2: I(b); (1,2): c~a diagonal table(0,1)+1 = 2 > 1; left: I(a); (1,1): C.
      assertThat(aligner.alignment(words("c"), words("c a b")).toString()).isEqualTo("C I I");
    }
  }

  @Nested
  class Properties {
    // Mathematical invariants of edit distance, over seeded random sequences (seed in every message).
    private static final long SEED = 20261202L;

    @Test
    void textAgainstItselfHasNoErrors() {
      SplittableRandom rnd = new SplittableRandom(SEED);
      for (int t = 0; t < 2000; t++) {
        int[] s = randomSeq(rnd, 30, 1 + rnd.nextInt(20));
        EditCounts c = aligner.count(s, s.clone());
        assertThat(c).as("seed %d trial %d", SEED, t).isEqualTo(new EditCounts(s.length, 0, 0, 0));
      }
    }

    @Test
    void totalErrorsUnchangedWhenReferenceAndHypothesisSwap() {
      SplittableRandom rnd = new SplittableRandom(SEED + 1);
      for (int t = 0; t < 2000; t++) {
        int alphabet = 1 + rnd.nextInt(10);
        int[] a = randomSeq(rnd, 20, alphabet);
        int[] b = randomSeq(rnd, 20, alphabet);
        assertThat(aligner.count(a, b).errors()).as("seed %d trial %d", SEED + 1, t).isEqualTo(aligner.count(b, a).errors());
      }
    }

    @Test
    void countsAreConsistentWithLengths() {
      SplittableRandom rnd = new SplittableRandom(SEED + 2);
      for (int t = 0; t < 2000; t++) {
        int alphabet = 1 + rnd.nextInt(10);
        int[] ref = randomSeq(rnd, 20, alphabet);
        int[] hyp = randomSeq(rnd, 20, alphabet);
        EditCounts c = aligner.count(ref, hyp);
        String msg = "seed " + (SEED + 2) + " trial " + t;
        assertThat(c.errors()).as(msg).isGreaterThanOrEqualTo(Math.abs(hyp.length - ref.length));
        assertThat(c.referenceTokens()).as(msg + " C+S+D = N").isEqualTo(ref.length);
        assertThat(c.correct() + c.substitutions() + c.insertions()).as(msg + " C+S+I = |hyp|").isEqualTo(hyp.length);
        assertThat(c.correct()).as(msg).isGreaterThanOrEqualTo(0);
        assertThat(c.substitutions()).as(msg).isGreaterThanOrEqualTo(0);
        assertThat(aligner.alignment(ref, hyp).counts()).as(msg + " alignment vs counts path").isEqualTo(c);
      }
    }

    @Test
    void alignmentStepsReadBothSequencesInOrder() {
      SplittableRandom rnd = new SplittableRandom(SEED + 3);
      for (int t = 0; t < 1000; t++) {
        int alphabet = 1 + rnd.nextInt(6);
        int[] ref = randomSeq(rnd, 15, alphabet);
        int[] hyp = randomSeq(rnd, 15, alphabet);
        Alignment al = aligner.alignment(ref, hyp);
        int nextRef = 0;
        int nextHyp = 0;
        String msg = "seed " + (SEED + 3) + " trial " + t;
        for (int k = 0; k < al.size(); k++) {
          if (al.refIndex(k) >= 0) assertThat(al.refIndex(k)).as(msg).isEqualTo(nextRef++);
          if (al.hypIndex(k) >= 0) assertThat(al.hypIndex(k)).as(msg).isEqualTo(nextHyp++);
          if (al.op(k) == Alignment.CORRECT) assertThat(ref[al.refIndex(k)]).as(msg).isEqualTo(hyp[al.hypIndex(k)]);
          if (al.op(k) == Alignment.SUBSTITUTION) assertThat(ref[al.refIndex(k)]).as(msg).isNotEqualTo(hyp[al.hypIndex(k)]);
        }
        assertThat(nextRef).as(msg).isEqualTo(ref.length);
        assertThat(nextHyp).as(msg).isEqualTo(hyp.length);
      }
    }

    @Test
    void bitParallelScalarAndTablePathsGiveIdenticalCounts() {
      // Invariant: the three implementations follow the same documented tie-breaking.
      SplittableRandom rnd = new SplittableRandom(SEED + 5);
      for (int t = 0; t < 3000; t++) {
        int alphabet = 1 + rnd.nextInt(t % 2 == 0 ? 4 : 30);
        int[] ref = randomSeq(rnd, t % 5 == 0 ? 70 : 20, alphabet);
        int[] hyp = randomSeq(rnd, t % 5 == 0 ? 70 : 20, alphabet);
        String msg = "seed " + (SEED + 5) + " trial " + t;
        EditCounts fast = aligner.count(ref, hyp);
        int cost = aligner.measureScalar(ref, ref.length, hyp, hyp.length);
        EditCounts scalar = new EditCounts(aligner.lastCorrect(), aligner.lastSubstitutions(), aligner.lastDeletions(), aligner.lastInsertions());
        assertThat(scalar).as(msg).isEqualTo(fast);
        assertThat((long) cost).as(msg).isEqualTo(fast.errors());
        assertThat(aligner.alignment(ref, hyp).counts()).as(msg).isEqualTo(fast);
        assertThat(aligner.distanceScalar(ref, ref.length, hyp, hyp.length)).as(msg).isEqualTo(aligner.distance(ref, hyp));
      }
    }

    @Test
    void handlesTokenIdsOfAnyValue() {
      int[] ref = {Integer.MIN_VALUE, -1, 0, Integer.MAX_VALUE};
      int[] hyp = {-1, 0, 7, Integer.MAX_VALUE};
      // Worked by hand: D(MIN) C(-1) C(0) I(7) C(MAX), cost 2 (three substitutions would cost 3).
      assertThat(aligner.count(ref, hyp)).isEqualTo(new EditCounts(3, 0, 1, 1));
      assertThat(aligner.alignment(ref, hyp).toString()).isEqualTo("D C C I C");
      assertThat(aligner.distance(ref, hyp)).isEqualTo(2);
    }

    @Test
    void reusedInstanceGivesSameAnswersAsFreshOne() {
      SplittableRandom rnd = new SplittableRandom(SEED + 4);
      for (int t = 0; t < 500; t++) {
        int[] ref = randomSeq(rnd, 60, 5);
        int[] hyp = randomSeq(rnd, 60, 5);
        assertThat(aligner.count(ref, hyp)).as("seed %d trial %d", SEED + 4, t).isEqualTo(new Aligner().count(ref, hyp));
      }
    }
  }

  @Nested
  class OptionalTokens {
    private static final long SEED = 77L;
    private static final int HESITATION = 1000;
    private static final int NOISE = 1001;

    @Test
    void optionalTokensNeverCount() {
      // Invariant: adding optional tokens anywhere on either side changes neither N nor any count.
      SplittableRandom rnd = new SplittableRandom(SEED);
      for (int t = 0; t < 1000; t++) {
        int[] ref = randomSeq(rnd, 15, 6);
        int[] hyp = randomSeq(rnd, 15, 6);
        EditCounts plain = aligner.count(ref, hyp);
        boolean[][] refOpt = new boolean[1][];
        boolean[][] hypOpt = new boolean[1][];
        int[] refWith = sprinkle(rnd, ref, refOpt);
        int[] hypWith = sprinkle(rnd, hyp, hypOpt);
        String msg = "seed " + SEED + " trial " + t;
        assertThat(aligner.count(refWith, refOpt[0], hypWith, hypOpt[0])).as(msg).isEqualTo(plain);
        assertThat(aligner.alignment(refWith, refOpt[0], hypWith, hypOpt[0]).counts()).as(msg).isEqualTo(plain);
      }
    }

    @Test
    void hesitationPresentOnlyInHypothesisIsNoError() {
      int[] ref = {1, 2};
      int[] hyp = {1, HESITATION, 2};
      assertThat(aligner.count(ref, new boolean[2], hyp, new boolean[] {false, true, false})).isEqualTo(new EditCounts(2, 0, 0, 0));
      Alignment al = aligner.alignment(ref, new boolean[2], hyp, new boolean[] {false, true, false});
      assertThat(al.toString()).isEqualTo("C C");
      assertThat(al.hypIndex(1)).as("index into the original hypothesis").isEqualTo(2);
    }

    @Test
    void optionalReferenceTokenIsNeverSubstituted() {
      // ref "uh pears" (uh optional), hyp "bears": without the flag S+D; with it one substitution only, N = 1.
      int[] ref = {HESITATION, 5};
      int[] hyp = {6};
      assertThat(aligner.count(ref, new boolean[] {true, false}, hyp, null)).isEqualTo(new EditCounts(0, 1, 0, 0));
    }

    private static int[] sprinkle(SplittableRandom rnd, int[] seq, boolean[][] flagsOut) {
      int extra = rnd.nextInt(4);
      int[] out = new int[seq.length + extra];
      boolean[] flags = new boolean[out.length];
      int k = 0;
      int left = extra;
      for (int i = 0; i <= seq.length; i++) {
        while (left > 0 && rnd.nextInt(3) == 0) {
          flags[k] = true;
          out[k++] = rnd.nextBoolean() ? HESITATION : NOISE;
          left--;
        }
        if (i < seq.length) out[k++] = seq[i];
      }
      while (left-- > 0) {
        flags[k] = true;
        out[k++] = HESITATION;
      }
      flagsOut[0] = flags;
      return out;
    }
  }
}
