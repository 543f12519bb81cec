package steelyard.rescore;

import static org.assertj.core.api.Assertions.assertThat;
import static org.assertj.core.api.Assertions.assertThatThrownBy;

import java.io.StringWriter;
import java.util.ArrayList;
import java.util.List;
import java.util.stream.IntStream;
import org.junit.jupiter.params.ParameterizedTest;
import org.junit.jupiter.params.provider.CsvSource;
import org.junit.jupiter.params.provider.ValueSource;
import org.junit.jupiter.api.Test;

class OutputFormatTest {
  /** Worked by hand: six decimals at most, trailing zeros dropped, scientific outside [1e-4, 1e12). */
  @ParameterizedTest(name = "[{index}] {arguments}")
  @CsvSource({
    "-12.805170186, -12.80517",
    "3.0, 3",
    "0.0, 0",
    "-0.5, -0.5",
    "0.0000004, 4.000000e-07",
    "123456789012345.0, 1.234568e+14",
    "0.9999996, 1",
  })
  void formatsNumbersTheSameWayEverywhere(double value, String expected) {
    assertThat(Csv.number(value)).isEqualTo(expected);
  }

  /** RFC 4180 §2: fields with commas, quotes or line breaks are quoted, quotes doubled. */
  @Test
  void quotesOnlyWhatRfc4180Requires() throws Exception {
    StringWriter w = new StringWriter();
    Csv.row(w, "plain", "a,b", "say \"hi\"", "two\nlines", "=SUM(A1)");
    assertThat(w.toString()).isEqualTo("plain,\"a,b\",\"say \"\"hi\"\"\",\"two\nlines\",=SUM(A1)\n");
  }

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
