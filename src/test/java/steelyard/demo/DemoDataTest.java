package steelyard.demo;

import static org.assertj.core.api.Assertions.assertThat;

import java.io.IOException;
import java.nio.charset.StandardCharsets;
import java.nio.file.Files;
import java.nio.file.Path;
import java.security.MessageDigest;
import java.security.NoSuchAlgorithmException;
import java.util.ArrayList;
import java.util.HashSet;
import java.util.HexFormat;
import java.util.LinkedHashMap;
import java.util.List;
import java.util.Locale;
import java.util.Map;
import java.util.Set;
import java.util.SortedMap;
import java.util.TreeMap;
import java.util.TreeSet;
import java.util.stream.Stream;
import org.junit.jupiter.api.BeforeAll;
import org.junit.jupiter.api.Nested;
import org.junit.jupiter.api.Test;
import org.junit.jupiter.api.io.TempDir;
import org.junit.jupiter.params.ParameterizedTest;
import org.junit.jupiter.params.provider.CsvSource;
import org.junit.jupiter.params.provider.ValueSource;
import steelyard.io.FeatureSpec;
import steelyard.io.HypothesesReader;
import steelyard.io.ImportOptions;
import steelyard.io.Reference;
import steelyard.io.ReferencesReader;
import steelyard.io.UtteranceHypotheses;
import steelyard.text.NormalisationOptions;
import steelyard.text.Normaliser;
import steelyard.text.TokenSequence;
import steelyard.text.Unit;

class DemoDataTest {
  private static final DemoData.Sizes SMALL = new DemoData.Sizes(30, 400, 20, 200);
  private static final String REGENERATE = "regenerate with: ./steelyard demo-data --out sample-hypotheses";

  /** The full default generation, made once: every structural check below reads it. */
  private static SortedMap<String, byte[]> full;

  @BeforeAll
  static void generateDefaultSet() {
    full = DemoData.generate(DemoData.DEFAULT_SEED, DemoData.Sizes.DEFAULT);
  }

  @Nested
  class Determinism {
    @Test
    void sameSeedGivesByteIdenticalFiles() {
      SortedMap<String, byte[]> a = DemoData.generate(99L, SMALL);
      SortedMap<String, byte[]> b = DemoData.generate(99L, SMALL);
      assertThat(b.keySet()).containsExactlyElementsOf(a.keySet());
      for (String name : a.keySet()) assertThat(b.get(name)).as(name).isEqualTo(a.get(name));
      assertThat(digest(b)).isEqualTo(digest(a));
    }

    @Test
    void differentSeedsGiveDifferentData() {
      SortedMap<String, byte[]> a = DemoData.generate(1L, SMALL);
      SortedMap<String, byte[]> b = DemoData.generate(2L, SMALL);
      assertThat(b.get("voice-dev.nbest.csv")).isNotEqualTo(a.get("voice-dev.nbest.csv"));
      assertThat(b.get("dockets-test.nbest.csv")).isNotEqualTo(a.get("dockets-test.nbest.csv"));
    }

    @ParameterizedTest(name = "[{index}] {arguments}")
    @ValueSource(strings = {"de-DE", "tr-TR", "ar-EG", "hi-IN"})
    void doesNotDependOnTheDefaultLocale(String tag) {
      SortedMap<String, byte[]> expected = DemoData.generate(11L, SMALL);
      Locale saved = Locale.getDefault();
      SortedMap<String, byte[]> actual;
      try {
        Locale.setDefault(Locale.forLanguageTag(tag));
        actual = DemoData.generate(11L, SMALL);
      } finally {
        Locale.setDefault(saved);
      }
      assertThat(digest(actual)).isEqualTo(digest(expected));
    }

    @Test
    void checkedInFilesEqualAFreshGenerationWithTheDefaultSeed() throws IOException {
      Path dir = Path.of("sample-hypotheses");
      assertThat(dir).as("sample-hypotheses/ at the project root").isDirectory();
      List<String> names;
      try (Stream<Path> files = Files.list(dir)) {
        names = files.map(p -> p.getFileName().toString()).sorted().toList();
      }
      assertThat(names).as(REGENERATE).containsExactlyElementsOf(full.keySet());
      for (String name : names) {
        assertThat(Files.readAllBytes(dir.resolve(name))).as(name + " differs from the generator's output; " + REGENERATE).isEqualTo(full.get(name));
      }
    }

    @Test
    void writesTheGeneratedBytesAndLeavesNoTemporaryFiles(@TempDir Path dir) throws IOException {
      Path out = dir.resolve("nested/out");
      List<Path> written = DemoData.write(out, 5L, SMALL);
      SortedMap<String, byte[]> expected = DemoData.generate(5L, SMALL);
      try (Stream<Path> files = Files.list(out)) {
        assertThat(files.map(p -> p.getFileName().toString()).sorted().toList()).containsExactlyElementsOf(expected.keySet());
      }
      assertThat(written).hasSize(expected.size());
      for (Path p : written) assertThat(Files.readAllBytes(p)).as(p.toString()).isEqualTo(expected.get(p.getFileName().toString()));
      // Writing again over existing files replaces them with the same bytes.
      DemoData.write(out, 5L, SMALL);
      for (Path p : written) assertThat(Files.readAllBytes(p)).isEqualTo(expected.get(p.getFileName().toString()));
    }
  }

  @Nested
  class VoiceSets {
    @ParameterizedTest(name = "[{index}] {arguments}")
    @ValueSource(strings = {"dev", "test"})
    void everyUtteranceHasOneToTwentyDistinctHypothesesRankedOneToN(String set) {
      byte[] file = full.get("voice-" + set + ".nbest.csv");
      assertThat(SimpleCsv.header(file)).containsExactly("utt_id", "rank", "text", "acoustic", "lm", "group");
      Map<String, List<Map<String, String>>> utts = contiguous(SimpleCsv.rows(file));
      assertThat(utts).hasSizeBetween(250, 350);
      for (Map.Entry<String, List<Map<String, String>>> e : utts.entrySet()) {
        List<Map<String, String>> rows = e.getValue();
        assertThat(rows).as(e.getKey()).hasSizeBetween(1, 20);
        Set<String> texts = new HashSet<>();
        for (int r = 0; r < rows.size(); r++) {
          assertThat(rows.get(r).get("rank")).as(e.getKey()).isEqualTo(Integer.toString(r + 1));
          assertThat(texts.add(rows.get(r).get("text"))).as("%s: duplicate hypothesis '%s'", e.getKey(), rows.get(r).get("text")).isTrue();
          assertThat(rows.get(r).get("group")).isEqualTo(rows.get(0).get("group")).matches("spk\\d\\d");
          assertThat(rows.get(r).get("text")).as(e.getKey()).matches("[a-z]+( [a-z]+)*");
        }
      }
    }

    @ParameterizedTest(name = "[{index}] {arguments}")
    @ValueSource(strings = {"dev", "test"})
    void scoresAreNegativeNaturalLogsAndRankFollowsTheFirstPassTotal(String set) {
      Map<String, List<Map<String, String>>> utts = contiguous(SimpleCsv.rows(full.get("voice-" + set + ".nbest.csv")));
      for (Map.Entry<String, List<Map<String, String>>> e : utts.entrySet()) {
        double previous = Double.POSITIVE_INFINITY;
        for (Map<String, String> row : e.getValue()) {
          double acoustic = Double.parseDouble(row.get("acoustic"));
          double lm = Double.parseDouble(row.get("lm"));
          assertThat(acoustic).as(e.getKey()).isNegative().isFinite();
          assertThat(lm).as(e.getKey()).isNegative().isFinite();
          int words = DemoScoring.words(row.get("text")).length;
          double total = acoustic + SpeechSimulator.LM_WEIGHT * lm + SpeechSimulator.WORD_BONUS * words;
          // Columns are rounded to 4 decimals, so allow that much slack in the order.
          assertThat(total).as("%s rank %s", e.getKey(), row.get("rank")).isLessThanOrEqualTo(previous + 1e-3);
          previous = total;
        }
      }
    }

    @ParameterizedTest(name = "[{index}] {arguments}")
    @ValueSource(strings = {"dev", "test"})
    void acousticScoresGrowWithLengthAndFavourCorrectHypotheses(String set) {
      Map<String, List<Map<String, String>>> utts = contiguous(SimpleCsv.rows(full.get("voice-" + set + ".nbest.csv")));
      Map<String, String> refs = new LinkedHashMap<>();
      for (Map<String, String> r : SimpleCsv.rows(full.get("voice-" + set + ".refs.csv"))) refs.put(r.get("utt_id"), r.get("text"));
      List<double[]> lengthVsAcoustic = new ArrayList<>();
      double bestAcousticErrors = 0;
      double randomPickErrors = 0;
      for (Map.Entry<String, List<Map<String, String>>> e : utts.entrySet()) {
        String[] ref = DemoScoring.words(refs.get(e.getKey()));
        lengthVsAcoustic.add(new double[] {refs.get(e.getKey()).length(), Double.parseDouble(e.getValue().get(0).get("acoustic"))});
        double best = Double.NEGATIVE_INFINITY;
        int errorsOfBest = 0;
        double sum = 0;
        for (Map<String, String> row : e.getValue()) {
          int errors = DemoScoring.distance(ref, DemoScoring.words(row.get("text")));
          sum += errors;
          double acoustic = Double.parseDouble(row.get("acoustic"));
          if (acoustic > best) {
            best = acoustic;
            errorsOfBest = errors;
          }
        }
        bestAcousticErrors += errorsOfBest;
        randomPickErrors += sum / e.getValue().size();
      }
      // Design targets of the data (its specification): acoustic roughly proportional to length (strongly
      // negative correlation with the reference's length), and correlated with correctness: picking the
      // best acoustic score makes fewer errors (by 10 % at least) than a uniformly random pick is expected to.
      assertThat(pearson(lengthVsAcoustic)).isLessThan(-0.8);
      System.out.printf(Locale.ROOT, "voice-%s: errors of the best-acoustic pick %.0f, of a random pick %.1f%n", set, bestAcousticErrors, randomPickErrors);
      assertThat(bestAcousticErrors).isLessThan(0.9 * randomPickErrors);
    }

    @ParameterizedTest(name = "[{index}] {arguments}")
    @ValueSource(strings = {"dev", "test"})
    void everyUtteranceHasExactlyOneReferenceOfLowercaseWords(String set) {
      Map<String, List<Map<String, String>>> utts = contiguous(SimpleCsv.rows(full.get("voice-" + set + ".nbest.csv")));
      List<Map<String, String>> refs = SimpleCsv.rows(full.get("voice-" + set + ".refs.csv"));
      assertThat(SimpleCsv.header(full.get("voice-" + set + ".refs.csv"))).containsExactly("utt_id", "text", "group");
      assertThat(refs.stream().map(r -> r.get("utt_id")).toList()).containsExactlyElementsOf(utts.keySet());
      for (Map<String, String> ref : refs) {
        assertThat(ref.get("text")).matches("[a-z]+( [a-z]+)*");
        assertThat(ref.get("group")).isEqualTo(utts.get(ref.get("utt_id")).get(0).get("group"));
      }
    }
  }

  @Nested
  class DocketSets {
    @ParameterizedTest(name = "[{index}] {arguments}")
    @ValueSource(strings = {"dev", "test"})
    void everyLineHasOneReadingPerConfigurationMostConfidentFirst(String set) {
      byte[] file = full.get("dockets-" + set + ".nbest.csv");
      assertThat(SimpleCsv.header(file)).containsExactly("utt_id", "rank", "system", "text", "confidence", "mean_word_conf", "group");
      Map<String, List<Map<String, String>>> lines = contiguous(SimpleCsv.rows(file));
      assertThat(lines).hasSizeBetween(150, 250);
      Set<String> systems = new TreeSet<>();
      for (OcrSimulator.Profile p : OcrSimulator.PROFILES) systems.add(p.name());
      assertThat(systems).hasSizeBetween(4, 6);
      for (Map.Entry<String, List<Map<String, String>>> e : lines.entrySet()) {
        List<Map<String, String>> rows = e.getValue();
        assertThat(rows.stream().map(r -> r.get("system")).sorted().toList()).as(e.getKey()).containsExactlyElementsOf(systems);
        double previous = 101;
        for (int r = 0; r < rows.size(); r++) {
          Map<String, String> row = rows.get(r);
          assertThat(row.get("rank")).as("one reading per configuration: its own rank 1").isEqualTo("1");
          double conf = Double.parseDouble(row.get("mean_word_conf"));
          assertThat(conf).isBetween(0.0, 100.0).isLessThanOrEqualTo(previous);
          previous = conf;
          // Definition of the column: natural log of the 0-1 confidence (6 decimals on disk).
          assertThat(Double.parseDouble(row.get("confidence"))).isCloseTo(Math.log(conf / 100), org.assertj.core.data.Offset.offset(1e-6));
        }
      }
      List<Map<String, String>> refs = SimpleCsv.rows(full.get("dockets-" + set + ".refs.csv"));
      assertThat(refs.stream().map(r -> r.get("utt_id")).toList()).containsExactlyElementsOf(lines.keySet());
    }
  }

  @Nested
  class Corpora {
    @ParameterizedTest(name = "[{index}] {arguments}")
    @ValueSource(strings = {"voice", "dockets"})
    void neverContainAnEvaluationSentence(String kind) {
      Set<String> evaluation = new HashSet<>();
      for (String set : new String[] {"dev", "test"}) {
        for (Map<String, String> r : SimpleCsv.rows(full.get(kind + "-" + set + ".refs.csv"))) evaluation.add(r.get("text"));
      }
      assertThat(evaluation).as("dev and test share no sentence").hasSize(kind.equals("voice") ? 600 : 400);
      List<String> corpus = lines(full.get("corpus-" + kind + ".txt"));
      assertThat(corpus).hasSizeBetween(kind.equals("voice") ? 20_000 : 10_000, kind.equals("voice") ? 40_000 : 20_000);
      for (String line : corpus) assertThat(evaluation).as("corpus line is an evaluation sentence").doesNotContain(line);
    }

    @Test
    void voiceCorpusIsLowercaseWordsLikeTheReferences() {
      for (String line : lines(full.get("corpus-voice.txt"))) assertThat(line).matches("[a-z]+( [a-z]+)*");
    }

    @Test
    void allFilesAreAsciiWithLfLineEndsAndTogetherStaySmall() {
      long total = 0;
      for (Map.Entry<String, byte[]> e : full.entrySet()) {
        byte[] b = e.getValue();
        total += b.length;
        assertThat(b[b.length - 1]).as(e.getKey() + " ends with a newline").isEqualTo((byte) '\n');
        for (byte x : b) assertThat(x >= 0x20 && x < 0x7f || x == '\n').as(e.getKey() + " holds printable ASCII and LF only").isTrue();
      }
      assertThat(total).as("bytes of all generated files").isLessThan(6_000_000L);
    }
  }

  @Nested
  class ProjectImporter {
    @ParameterizedTest(name = "[{index}] {arguments}")
    @CsvSource({
      "voice-dev, 'acoustic,lm'",
      "voice-test, 'acoustic,lm'",
      "dockets-dev, 'confidence,mean_word_conf:linear:scale=0.01'",
      "dockets-test, 'confidence,mean_word_conf:linear:scale=0.01'"
    })
    void readsTheCheckedInFilesStrictlyWithoutWarnings(String set, String features) {
      Path dir = Path.of("sample-hypotheses");
      List<String> warnings = new ArrayList<>();
      ImportOptions options = new ImportOptions(FeatureSpec.parseList(features), null, 0, warnings::add, skipped -> warnings.add(skipped.toString()));
      Map<String, Reference> refs = ReferencesReader.readAll(dir.resolve(set + ".refs.csv"), options);
      int utterances = 0;
      try (HypothesesReader reader = HypothesesReader.open(dir.resolve(set + ".nbest.csv"), options)) {
        while (reader.hasNext()) {
          UtteranceHypotheses u = reader.next();
          utterances++;
          assertThat(refs).containsKey(u.uttId());
          assertThat(u.first().rank()).isEqualTo(1);
          assertThat(u.first().group()).isEqualTo(refs.get(u.uttId()).group());
        }
        assertThat(reader.rowsSkipped()).isZero();
      }
      assertThat(utterances).isEqualTo(refs.size());
      assertThat(warnings).isEmpty();
    }
  }

  @Nested
  class RulesFile {
    @Test
    void voiceRulesMakeTheInsertedHesitationsOptionalForTheProjectsNormaliser(@TempDir Path dir) throws IOException {
      Path rules = Files.write(dir.resolve("voice.rules"), full.get("voice.rules"));
      Normaliser normaliser = Normaliser.create(new NormalisationOptions(false, false, false, false, rules));
      TokenSequence tokens = normaliser.tokens("move uh pallet um two", Unit.WORD);
      assertThat(tokens.tokens()).containsExactly("move", "uh", "pallet", "um", "two");
      assertThat(tokens.optional()).containsExactly(false, true, false, true, false);
    }
  }

  @Nested
  class Figures {
    @ParameterizedTest(name = "[{index}] {arguments}")
    @ValueSource(strings = {"voice-dev", "voice-test", "dockets-dev", "dockets-test"})
    void oracleIsNoWorseThanRankOneAndWithinTheDesignTargets(String set) {
      DemoScoring.Figures f = DemoScoring.figures(full.get(set + ".nbest.csv"), full.get(set + ".refs.csv"));
      System.out.printf(Locale.ROOT, "%s (seed %d): WER rank 1 %s, oracle %s; CER rank 1 %s, oracle %s%n",
          set, DemoData.DEFAULT_SEED, f.firstWord(), f.oracleWord(), f.firstChar(), f.oracleChar());
      if (set.startsWith("dockets")) {
        System.out.println("  CER per configuration: " + DemoScoring.perSystemChar(full.get(set + ".nbest.csv"), full.get(set + ".refs.csv")));
      }
      // Invariant: the oracle is the minimum over a list that includes rank 1.
      assertThat(f.oracleWord().errors()).isLessThanOrEqualTo(f.firstWord().errors());
      assertThat(f.oracleChar().errors()).isLessThanOrEqualTo(f.firstChar().errors());
      if (set.startsWith("voice")) {
        // Design targets of the demo data (its specification: rank-1 WER about 20-30 %, oracle about 8-12 %),
        // with a margin; these are requirements on the generator, not measured reference values.
        assertThat(f.firstWord().value()).isBetween(0.18, 0.32);
        assertThat(f.oracleWord().value()).isBetween(0.06, 0.14);
      } else {
        // Design target: combining configurations must have room to help (line oracle clearly below rank 1).
        assertThat(f.oracleChar().value()).isLessThan(0.8 * f.firstChar().value());
      }
    }
  }

  /** Pearson's sample correlation coefficient of (x, y) pairs (textbook formula). */
  private static double pearson(List<double[]> xy) {
    double mx = xy.stream().mapToDouble(p -> p[0]).average().orElseThrow();
    double my = xy.stream().mapToDouble(p -> p[1]).average().orElseThrow();
    double sxy = 0;
    double sxx = 0;
    double syy = 0;
    for (double[] p : xy) {
      sxy += (p[0] - mx) * (p[1] - my);
      sxx += (p[0] - mx) * (p[0] - mx);
      syy += (p[1] - my) * (p[1] - my);
    }
    return sxy / Math.sqrt(sxx * syy);
  }

  private static Map<String, List<Map<String, String>>> contiguous(List<Map<String, String>> rows) {
    Map<String, List<Map<String, String>>> out = new LinkedHashMap<>();
    String current = null;
    for (Map<String, String> row : rows) {
      String id = row.get("utt_id");
      if (!id.equals(current)) {
        assertThat(out).as("rows of %s are contiguous", id).doesNotContainKey(id);
        out.put(id, new ArrayList<>());
        current = id;
      }
      out.get(id).add(row);
    }
    return out;
  }

  private static List<String> lines(byte[] file) {
    String text = new String(file, StandardCharsets.UTF_8);
    return List.of(text.substring(0, text.length() - 1).split("\n", -1));
  }

  private static String digest(SortedMap<String, byte[]> files) {
    try {
      MessageDigest md = MessageDigest.getInstance("SHA-256");
      for (Map.Entry<String, byte[]> e : new TreeMap<>(files).entrySet()) {
        md.update(e.getKey().getBytes(StandardCharsets.UTF_8));
        md.update((byte) 0);
        md.update(e.getValue());
      }
      return HexFormat.of().formatHex(md.digest());
    } catch (NoSuchAlgorithmException e) {
      throw new IllegalStateException(e);
    }
  }
}
