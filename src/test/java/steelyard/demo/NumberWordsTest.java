package steelyard.demo;

import static org.assertj.core.api.Assertions.assertThat;
import static org.assertj.core.api.Assertions.assertThatThrownBy;

import java.util.HashSet;
import java.util.Set;
import org.junit.jupiter.api.Test;
import org.junit.jupiter.params.ParameterizedTest;
import org.junit.jupiter.params.provider.CsvSource;

class NumberWordsTest {
  // English number names (British usage with "and" after hundred/thousand), worked by hand.
  @ParameterizedTest(name = "[{index}] {arguments}")
  @CsvSource({
    "0, zero",
    "7, seven",
    "13, thirteen",
    "40, forty",
    "44, forty four",
    "100, one hundred",
    "115, one hundred and fifteen",
    "250, two hundred and fifty",
    "1000, one thousand",
    "1005, one thousand and five",
    "4821, four thousand eight hundred and twenty one",
    "9999, nine thousand nine hundred and ninety nine"
  })
  void spellsCardinalsAsSpoken(int n, String words) {
    assertThat(NumberWords.cardinal(n)).isEqualTo(words);
  }

  // Clock times and docket numbers as read aloud, worked by hand.
  @Test
  void readsTimesDigitsAndPairs() {
    assertThat(NumberWords.time(7, 0)).isEqualTo("seven");
    assertThat(NumberWords.time(6, 5)).isEqualTo("six oh five");
    assertThat(NumberWords.time(9, 30)).isEqualTo("nine thirty");
    assertThat(NumberWords.time(14, 45)).isEqualTo("two forty five");
    assertThat(NumberWords.digits("4807")).isEqualTo("four eight oh seven");
    assertThat(NumberWords.pairs(4821)).isEqualTo("forty eight twenty one");
    assertThat(NumberWords.pairs(4807)).isEqualTo("forty eight oh seven");
    assertThat(NumberWords.pairs(4800)).isEqualTo("forty eight hundred");
  }

  // Invariant: distinct numbers must be spoken differently, or references would be ambiguous.
  @Test
  void givesEveryCardinalItsOwnWords() {
    Set<String> seen = new HashSet<>();
    for (int n = 0; n <= 9999; n++) {
      String w = NumberWords.cardinal(n);
      assertThat(seen.add(w)).as("n=%d gives '%s' twice", n, w).isTrue();
      assertThat(w).matches("[a-z]+( [a-z]+)*");
    }
  }

  @Test
  void rejectsNumbersOutsideItsRange() {
    assertThatThrownBy(() -> NumberWords.cardinal(10000)).isInstanceOf(IllegalArgumentException.class);
    assertThatThrownBy(() -> NumberWords.digits("4a")).isInstanceOf(IllegalArgumentException.class);
  }
}
