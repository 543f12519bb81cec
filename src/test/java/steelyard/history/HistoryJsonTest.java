package steelyard.history;

import static org.assertj.core.api.Assertions.assertThat;
import static org.assertj.core.api.Assertions.assertThatThrownBy;

import java.time.DateTimeException;
import java.time.Instant;
import java.time.temporal.ChronoUnit;
import java.util.List;
import java.util.SplittableRandom;
import org.junit.jupiter.api.Test;

class HistoryJsonTest {
  private static final long SEED = 20261202L;

  @Test
  void storedTimesReadBackAsTheJdkIsoParserReadsThem() {
    // Reference: java.time.Instant.parse (ISO-8601) on the same text, over seeded instants from 1970 to 2200.
    SplittableRandom rnd = new SplittableRandom(SEED);
    for (int i = 0; i < 10_000; i++) {
      Instant t = Instant.ofEpochMilli(rnd.nextLong(7_258_118_400_000L));
      String text = HistoryJson.time(t);
      assertThat(text).as("seed %d", SEED).hasSize(24);
      assertThat(HistoryJson.parseTime(text)).as(text).isEqualTo(Instant.parse(text)).isEqualTo(t.truncatedTo(ChronoUnit.MILLIS));
    }
  }

  @Test
  void otherIsoFormsStillParseAndNonsenseDoesNot() {
    assertThat(HistoryJson.parseTime("2026-12-02T10:15:30Z")).isEqualTo(Instant.parse("2026-12-02T10:15:30Z"));
    assertThatThrownBy(() -> HistoryJson.parseTime("2026-13-02T10:15:30.000Z")).isInstanceOf(DateTimeException.class);
    assertThatThrownBy(() -> HistoryJson.parseTime("yesterday")).isInstanceOf(DateTimeException.class);
  }

  @Test
  void stringListsRoundTripWithQuotesCommasAndNonAscii() {
    List<String> args = List.of("score", "--names", "baseline,tuned", "say \"bay four\"", "Tallowmere — é 🍐", "");
    assertThat(HistoryJson.parseStrings(HistoryJson.strings(args))).isEqualTo(args);
  }
}
