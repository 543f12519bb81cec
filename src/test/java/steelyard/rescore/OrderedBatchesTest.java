package steelyard.rescore;

import static org.assertj.core.api.Assertions.assertThat;
import static org.assertj.core.api.Assertions.assertThatThrownBy;

import java.util.ArrayList;
import java.util.List;
import java.util.stream.IntStream;
import org.junit.jupiter.params.ParameterizedTest;
import org.junit.jupiter.params.provider.ValueSource;
import org.junit.jupiter.api.Test;

/** The ordered batches behind every streaming run. */
class OrderedBatchesTest {
  /** Invariant: results arrive in input order whatever the thread count. */
  @ParameterizedTest(name = "[{index}] threads={0}")
  @ValueSource(ints = {1, 2, 3, 8})
  void batchesKeepInputOrder(int threads) throws Exception {
    List<Integer> out = new ArrayList<>();
    OrderedBatches.run(IntStream.range(0, 1000).boxed().iterator(), i -> i * 2, threads, 7, out::add);
    assertThat(out).isEqualTo(IntStream.range(0, 1000).map(i -> i * 2).boxed().toList());
  }

  @Test
  void aFailingItemStopsTheRunWithItsOwnException() {
    assertThatThrownBy(() -> OrderedBatches.run(IntStream.range(0, 100).boxed().iterator(), i -> {
      if (i == 57) throw new IllegalArgumentException("item 57");
      return i;
    }, 4, 10, r -> {}))
        .isInstanceOf(IllegalArgumentException.class)
        .hasMessage("item 57");
  }
}
