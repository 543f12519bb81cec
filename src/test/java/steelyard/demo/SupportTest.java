package steelyard.demo;

import static org.assertj.core.api.Assertions.assertThat;

import com.opencsv.CSVReader;
import java.io.StringReader;
import java.util.SplittableRandom;
import org.apache.commons.text.similarity.LevenshteinDistance;
import org.junit.jupiter.api.Nested;
import org.junit.jupiter.api.Test;

class SupportTest {
  @Nested
  class Csv {
    // RFC 4180 section 2, rules 6 and 7: fields with commas, quotes or line breaks are enclosed in double
    // quotes, and a quote inside is escaped by doubling it.
    @Test
    void quotesFieldsAsRfc4180Requires() {
      assertThat(CsvText.row("Lot 12/04 Pears")).isEqualTo("Lot 12/04 Pears\n");
      assertThat(CsvText.row("6 pallets Leeks, 2 bins Kale")).isEqualTo("\"6 pallets Leeks, 2 bins Kale\"\n");
      assertThat(CsvText.row("say \"ok\"")).isEqualTo("\"say \"\"ok\"\"\"\n");
      assertThat(CsvText.row("a", "b,c")).isEqualTo("a,\"b,c\"\n");
    }

    // Reference library: opencsv reads back exactly the fields written, for random printable strings.
    @Test
    void roundTripsThroughAGeneralCsvReader() throws Exception {
      long seed = 41L;
      SplittableRandom random = new SplittableRandom(seed);
      String alphabet = "ab ,\"':/-()1 ";
      for (int trial = 0; trial < 2000; trial++) {
        String[] fields = new String[1 + random.nextInt(4)];
        for (int f = 0; f < fields.length; f++) {
          StringBuilder sb = new StringBuilder();
          int len = random.nextInt(8);
          for (int i = 0; i < len; i++) sb.append(alphabet.charAt(random.nextInt(alphabet.length())));
          fields[f] = sb.toString();
        }
        try (CSVReader reader = new CSVReader(new StringReader(CsvText.row(fields)))) {
          assertThat(reader.readNext()).as("seed %d trial %d", seed, trial).containsExactly(fields);
        }
      }
    }

    @Test
    void formatsNumbersWithAPointWhateverTheLocale() {
      java.util.Locale saved = java.util.Locale.getDefault();
      try {
        java.util.Locale.setDefault(java.util.Locale.GERMANY);
        assertThat(CsvText.fixed(-12.5, 4)).isEqualTo("-12.5000");
      } finally {
        java.util.Locale.setDefault(saved);
      }
    }
  }

  @Nested
  class Scoring {
    // Reference library: commons-text LevenshteinDistance (unit-cost edit distance) on random sequences,
    // tokens mapped to code points.
    @Test
    void editDistanceAgreesWithCommonsText() {
      long seed = 7L;
      SplittableRandom random = new SplittableRandom(seed);
      LevenshteinDistance reference = LevenshteinDistance.getDefaultInstance();
      for (int trial = 0; trial < 3000; trial++) {
        String[] a = randomTokens(random);
        String[] b = randomTokens(random);
        assertThat(DemoScoring.distance(a, b)).as("seed %d trial %d", seed, trial).isEqualTo(reference.apply(codePoints(a), codePoints(b)));
      }
    }

    private final java.util.List<String> vocab = java.util.List.of("bay", "day", "pallet", "the", "a", "fifteen", "fifty");

    private String[] randomTokens(SplittableRandom random) {
      String[] out = new String[random.nextInt(12)];
      for (int i = 0; i < out.length; i++) out[i] = vocab.get(random.nextInt(vocab.size()));
      return out;
    }

    /** One distinct letter per vocabulary word. */
    private String codePoints(String[] tokens) {
      StringBuilder sb = new StringBuilder();
      for (String t : tokens) sb.append((char) ('A' + vocab.indexOf(t)));
      return sb.toString();
    }
  }

  @Nested
  class Randomness {
    // Statistical check (common practice): the sample mean of n draws lies within 5 standard errors.
    @Test
    void drawsHaveTheIntendedMoments() {
      Dice dice = new Dice(3L);
      int n = 200_000;
      double sumU = 0;
      double sumG = 0;
      double sumG2 = 0;
      for (int i = 0; i < n; i++) {
        double u = dice.uniform();
        assertThat(u).isBetween(0.0, 1.0).isLessThan(1.0);
        sumU += u;
        double g = dice.gaussian();
        sumG += g;
        sumG2 += g * g;
      }
      double se = 1 / Math.sqrt(n);
      assertThat(sumU / n).isCloseTo(0.5, org.assertj.core.data.Offset.offset(5 * se * Math.sqrt(1.0 / 12)));
      assertThat(sumG / n).isCloseTo(0.0, org.assertj.core.data.Offset.offset(5 * se));
      // Var of the sample variance of a standard normal is 2/n (normal theory).
      assertThat(sumG2 / n).isCloseTo(1.0, org.assertj.core.data.Offset.offset(5 * Math.sqrt(2.0) * se));
    }

    @Test
    void boundedDrawsStayInRangeAndStreamsDependOnTheirName() {
      Dice dice = new Dice(5L);
      for (int i = 0; i < 10_000; i++) assertThat(dice.between(3, 7)).isBetween(3, 7);
      assertThat(Dice.derive(1L, "voice-dev")).isNotEqualTo(Dice.derive(1L, "voice-test")).isNotEqualTo(Dice.derive(2L, "voice-dev"));
    }
  }
}
