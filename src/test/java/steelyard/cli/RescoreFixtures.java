package steelyard.cli;


import com.opencsv.CSVReader;
import java.io.ByteArrayOutputStream;
import java.io.IOException;
import java.io.PrintStream;
import java.io.Reader;
import java.nio.charset.StandardCharsets;
import java.nio.file.Files;
import java.nio.file.Path;
import java.util.ArrayList;
import java.util.List;
import java.util.Locale;
import java.util.SplittableRandom;

/** Shared helpers of the command tests: in-process runs with captured streams, seeded data sets. */
final class RescoreFixtures {
  private RescoreFixtures() {}

  static RescoreCommandTest.Result run(String... args) {
    ScoreCommandTest.Result r = ScoreCommandTest.run(args);
    return new RescoreCommandTest.Result(r.code(), r.out(), r.err());
  }

  /** The demo's voice dev set, rules and model, with which the history tests rescore. */
  static final String VOICE_DEV = "sample-hypotheses/voice-dev.nbest.csv";
  static final String VOICE_RULES = "sample-hypotheses/voice.rules";
  static final String VOICE_LM = "models/voice-3gram.arpa.gz";

  /**
   * Rescoring the voice dev set with {@code weights} (a weights file) gives {@code picks} byte for byte, and the
   * default weights do not (so the check is not vacuous).
   */
  static void assertVoiceDevWeightsReproduce(Path dir, Path weights, Path picks) throws IOException {
    Path again = dir.resolve("again.csv");
    succeed("rescore", "--hyps", VOICE_DEV, "--rules", VOICE_RULES, "--lm", VOICE_LM, "--weights", weights.toString(), "--out",
        again.toString());
    org.assertj.core.api.Assertions.assertThat(Files.readAllBytes(again)).isEqualTo(Files.readAllBytes(picks));
    Path plain = dir.resolve("plain.csv");
    succeed("rescore", "--hyps", VOICE_DEV, "--rules", VOICE_RULES, "--lm", VOICE_LM, "--features", "acoustic,lm", "--out",
        plain.toString());
    org.assertj.core.api.Assertions.assertThat(Files.readAllBytes(plain)).isNotEqualTo(Files.readAllBytes(picks));
  }

  private static void succeed(String... args) {
    ScoreCommandTest.Result r = ScoreCommandTest.run(args);
    org.assertj.core.api.Assertions.assertThat(r.code()).as(String.join(" ", args) + "\n" + r.err()).isZero();
  }

  static List<String[]> readCsv(Path file) throws IOException {
    try (Reader r = Files.newBufferedReader(file); CSVReader csv = new CSVReader(r)) {
      return csv.readAll();
    } catch (com.opencsv.exceptions.CsvException e) {
      throw new IOException(e);
    }
  }

  private static final String[] WORDS = {"ten", "crates", "of", "pears", "bay", "nine", "load", "the", "leeks", "cold", "store", "pallet"};

  /**
   * A seeded invented set: systems a and b, up to 6 hypotheses each, acoustic scores falling with rank (b's
   * 1000 lower) and a 0–1 confidence; references are the sentences the hypotheses were garbled from; one
   * utterance in 17 has no reference and one reference has no hypotheses.
   */
  static void writeRandomSet(Path hyps, Path refs, long seed, int utterances) throws IOException {
    SplittableRandom rnd = new SplittableRandom(seed);
    StringBuilder h = new StringBuilder("utt_id,system,rank,text,acoustic,conf\n");
    StringBuilder r = new StringBuilder("utt_id,text\n");
    for (int u = 0; u < utterances; u++) {
      String id = String.format(Locale.ROOT, "dock-%04d", u);
      List<String> ref = new ArrayList<>();
      int len = 2 + rnd.nextInt(8);
      for (int k = 0; k < len; k++) ref.add(WORDS[rnd.nextInt(WORDS.length)]);
      if (u % 17 != 5) r.append(id).append(',').append(String.join(" ", ref)).append('\n');
      for (String sys : new String[] {"a", "b"}) {
        int n = 1 + rnd.nextInt(6);
        // system b's scores live on another scale (−1000): rank 1 of a stays the best total overall
        double ac = -10 * len - ("b".equals(sys) ? 1000 : 0);
        for (int rank = 1; rank <= n; rank++) {
          ac -= rnd.nextInt(3) == 0 ? 0 : rnd.nextDouble() * 5;
          List<String> t = new ArrayList<>(ref);
          int edits = rnd.nextInt(3);
          for (int e = 0; e < edits && !t.isEmpty(); e++) {
            int pos = rnd.nextInt(t.size());
            switch (rnd.nextInt(3)) {
              case 0: t.set(pos, WORDS[rnd.nextInt(WORDS.length)]); break;
              case 1: t.remove(pos); break;
              default: t.add(pos, WORDS[rnd.nextInt(WORDS.length)]);
            }
          }
          double conf = 0.05 + 0.9 * rnd.nextDouble();
          h.append(id).append(',').append(sys).append(',').append(rank).append(',').append(String.join(" ", t))
              .append(',').append(String.format(Locale.ROOT, "%.3f", ac)).append(',').append(String.format(Locale.ROOT, "%.3f", conf)).append('\n');
        }
      }
    }
    r.append("dock-lost,crates of leeks\n");
    Files.writeString(hyps, h.toString());
    Files.writeString(refs, r.toString());
  }
}
