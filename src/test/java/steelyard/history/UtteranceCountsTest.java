package steelyard.history;

import static org.assertj.core.api.Assertions.assertThat;
import static org.assertj.core.api.Assertions.assertThatThrownBy;

import java.util.ArrayList;
import java.util.Collections;
import java.util.List;
import java.util.SplittableRandom;
import org.junit.jupiter.api.Test;

class UtteranceCountsTest {
  private static final long SEED = 7L;

  @Test
  void reorderingAShuffledRunRestoresReferenceOrderAndKeepsUnreferencedRowsLast() {
    // Invariant: shuffling rows and putting them back in reference order is the identity on the referenced rows.
    UtteranceCounts original = HistoryFixtures.rows(SEED, 200);
    List<Integer> order = new ArrayList<>();
    for (int i = 0; i < original.size(); i++) order.add(i);
    Collections.shuffle(order, new java.util.Random(SEED));
    UtteranceCounts.Builder shuffled = new UtteranceCounts.Builder(0);
    for (int i : order) shuffled.add(original.uttId(i), original.status(i), original.errors(i), original.referenceTokens(i));
    shuffled.add("tpc-x-0001", UtteranceStatus.NO_REFERENCE, 0, 0);
    List<String> refs = new ArrayList<>();
    for (int i = 0; i < original.size(); i++) refs.add(original.uttId(i));
    refs.add("tpc-v-9999");
    UtteranceCounts back = shuffled.build().inOrderOf(refs);
    assertThat(back.size()).isEqualTo(original.size() + 1);
    for (int i = 0; i < original.size(); i++) {
      assertThat(back.uttId(i)).as("seed %d row %d", SEED, i).isEqualTo(original.uttId(i));
      assertThat(back.errors(i)).isEqualTo(original.errors(i));
    }
    assertThat(back.uttId(original.size())).isEqualTo("tpc-x-0001");
  }

  @Test
  void includedArraysAndCountsFollowTheStatuses() {
    UtteranceCounts u = new UtteranceCounts.Builder(0).add("a", UtteranceStatus.SCORED, 2, 5).add("b", UtteranceStatus.MISSING_EXCLUDED, 0, 4)
        .add("c", UtteranceStatus.MISSING_HYPOTHESIS, 3, 3).add("d", UtteranceStatus.NO_REFERENCE, 0, 0).build();
    assertThat(u.includedErrors()).containsExactly(2, 3);
    assertThat(u.includedReferenceTokens()).containsExactly(5, 3);
    assertThat(u.includedWithErrors()).isEqualTo(2);
    assertThat(u.idsWith(UtteranceStatus.NO_REFERENCE)).containsExactly("d");
  }

  @Test
  void negativeCountsAreRefused() {
    assertThatThrownBy(() -> new UtteranceCounts.Builder(1).add("a", UtteranceStatus.SCORED, -1, 2))
        .isInstanceOf(IllegalArgumentException.class).hasMessageContaining("errors -1");
  }

  @Test
  void theBuilderGrowsPastItsExpectedSize() {
    SplittableRandom rnd = new SplittableRandom(SEED);
    UtteranceCounts.Builder b = new UtteranceCounts.Builder(0);
    for (int i = 0; i < 1000; i++) b.add("u" + i, UtteranceStatus.SCORED, rnd.nextInt(3), 3);
    assertThat(b.build().size()).isEqualTo(1000);
  }
}
