package steelyard.lattice;

import static org.assertj.core.api.Assertions.assertThat;

import java.util.ArrayList;
import java.util.Arrays;
import java.util.List;
import java.util.regex.Matcher;
import java.util.regex.Pattern;
import org.junit.jupiter.api.Test;
import steelyard.text.Normaliser;

/**
 * Voting over several systems' outputs: the classic reason for combination (Fiscus 1997) is that systems
 * err in different places, so a majority per slot can be right where every single system is wrong.
 */
class SystemCombinationTest {
  private static List<String> words(String s) {
    return Arrays.asList(s.split(" "));
  }

  /** Grapheme clusters (regex \X), a run of whitespace as the space token: the character unit, written here. */
  private static List<String> graphemes(String s) {
    List<String> out = new ArrayList<>();
    Matcher m = Pattern.compile("\\s+|\\X").matcher(s);
    while (m.find()) out.add(m.group().isBlank() ? Normaliser.SPACE_TOKEN : m.group());
    return out;
  }

  @Test
  void wordLevelVotingRecoversTheReferenceWhenEachSystemErrsElsewhere() {
    // Worked by hand: system 1 substitutes "fourteen", system 2 deletes "of", system 3 inserts "the";
    // every slot then has a 2-of-3 majority for the reference word (or for the empty arc).
    List<String> ref = words("deliver forty crates of plums to bay seven");
    List<List<String>> outputs = List.of(
        words("deliver fourteen crates of plums to bay seven"),
        words("deliver forty crates plums to bay seven"),
        words("deliver forty crates of plums to the bay seven"));
    for (List<String> o : outputs) assertThat(o).isNotEqualTo(ref);
    LatticeChoice v = Lattices.vote(outputs, new double[] {1, 1, 1});
    assertThat(v.tokens()).isEqualTo(ref);
    assertThat(v.isNewTranscript()).isTrue();
  }

  @Test
  void characterLevelVotingRecoversAnOcrDocketLine() {
    // Worked by hand: "rn" read for "m", "Z" for "2", "l" for "1", one system each; per character slot the
    // other two systems agree on the reference character.
    List<String> ref = graphemes("Plums x12 Bay 7");
    List<List<String>> outputs = List.of(graphemes("Plurns x12 Bay 7"), graphemes("Plums x1Z Bay 7"), graphemes("Plums xl2 Bay 7"));
    for (List<String> o : outputs) assertThat(o).isNotEqualTo(ref);
    assertThat(ref).contains(Normaliser.SPACE_TOKEN);
    LatticeChoice v = Lattices.vote(outputs, new double[] {1, 1, 1});
    assertThat(v.tokens()).isEqualTo(ref);
  }

  @Test
  void characterLevelKeepsCombiningMarksInsideTheirCluster() {
    // Unicode UAX #29: "e" + U+0301 is one extended grapheme cluster, so it is one token and one arc.
    List<String> ref = graphemes("Cre\u0301me 3");
    List<List<String>> outputs = List.of(graphemes("Cre\u0301me 3"), graphemes("Creme 3"), graphemes("Cre\u0301me 8"));
    LatticeChoice v = Lattices.vote(outputs, new double[] {1, 1, 1});
    assertThat(v.tokens()).isEqualTo(ref).contains("e\u0301");
  }

  @Test
  void voteWithTheLmCanOverruleAMajority() {
    // Worked by hand: "pears" has 2 of 3 votes (ln 2/3 = −0.41) against "plums" (ln 1/3 = −1.10); the model
    // gives log10 P(pears | of) = −4 and log10 P(plums | of) = −0.1, so with λ′ = 1 plums wins by ≈ 8.3 nats.
    NaiveBackoffLm n = new NaiveBackoffLm(2);
    n.add(-99, 0, "<s>");
    n.add(-1, 0, "</s>");
    n.add(-3, 0, "<unk>");
    for (String w : words("crates of pears plums")) n.add(-1, 0, w);
    n.add(-0.1, 0, "of", "plums");
    n.add(-4, 0, "of", "pears");
    List<List<String>> outputs = List.of(words("crates of pears"), words("crates of pears"), words("crates of plums"));
    double[] w = {1, 1, 1};
    assertThat(Lattices.vote(outputs, w).tokens()).isEqualTo(words("crates of pears"));
    assertThat(Lattices.vote(outputs, w, w, n.model(), new LatticeSettings(1, 0, 64, 1)).tokens()).isEqualTo(words("crates of plums"));
    assertThat(Lattices.vote(outputs, w, w, null, new LatticeSettings(0, 0, 64, 1)).tokens()).isEqualTo(words("crates of pears"));
  }

  @Test
  void systemWeightsAndConfidencesDecideAnEvenSplit() {
    // Worked by hand: posterior ∝ weight × confidence; 3×1 > 1×1 picks system 1; 1×0.3 < 1×0.9 picks system 2.
    List<List<String>> outputs = List.of(words("six trays"), words("six crates"));
    assertThat(Lattices.vote(outputs, new double[] {3, 1}).tokens()).isEqualTo(outputs.get(0));
    assertThat(Lattices.vote(outputs, new double[] {1, 3}).tokens()).isEqualTo(outputs.get(1));
    assertThat(Lattices.vote(outputs, new double[] {1, 1}, new double[] {0.3, 0.9}).tokens()).isEqualTo(outputs.get(1));
    assertThat(Lattices.vote(outputs, new double[] {1, 1}, new double[] {0.3, 0.9}).sourceHypothesis()).isEqualTo(1);
  }
}
