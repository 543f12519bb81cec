package steelyard.lm;

import static org.assertj.core.api.Assertions.assertThat;
import static org.assertj.core.api.Assertions.within;

import java.nio.file.Path;
import java.util.List;
import org.junit.jupiter.api.Test;
import org.junit.jupiter.api.io.TempDir;

/** A model → ARPA → read → binary → read keeps its scores, and stays a probability distribution. */
class ModelRoundTripTest {
  static final List<String> TRAIN = List.of(
      "ten crates of apples to bay four", "four crates of pears to bay two", "apples to bay four",
      "ten crates of pears", "two pallets of apples to cold store", "pears to cold store",
      "ten pallets of apples", "crates of apples to bay two");
  static final List<String> HELD_OUT = List.of(
      "ten crates of apples to cold store", "two crates of plums", "pallets to bay four", "apples apples apples",
      "plums to bay nine");

  @TempDir Path dir;

  @Test
  void arpaThenBinaryGiveTheSameScoresOnHeldOutText() {
    BackoffModel original = TinyKatzModel.train(TRAIN, 3);
    Path arpa = dir.resolve("docks.arpa.gz");
    ModelFiles.save(original, arpa);
    BackoffModel fromArpa = ModelFiles.loadExact(arpa);
    Path bin = dir.resolve("docks.bin");
    ModelFiles.save(fromArpa, bin);
    LanguageModel fromBin = ModelFiles.load(bin);
    BackoffModel exactFromBin = ModelFiles.loadExact(bin);
    for (String s : HELD_OUT) {
      double[] a = tokenScores(original, s);
      double[] b = tokenScores(fromArpa, s);
      double[] c = tokenScores(fromBin, s);
      double[] d = tokenScores(exactFromBin, s);
      for (int i = 0; i < a.length; i++) {
        // 1e-5 in log10 per token: 7 significant digits on disk, single precision in the binary file
        assertThat(b[i]).as("%s, token %d, ARPA", s, i).isCloseTo(a[i], within(1e-5));
        assertThat(c[i]).as("%s, token %d, binary", s, i).isCloseTo(b[i], within(1e-5));
        assertThat(d[i]).as("%s, token %d, binary rebuilt", s, i).isCloseTo(b[i], within(1e-5));
      }
    }
    assertThat(fromBin.unit()).isEqualTo(original.unit());
    assertThat(fromBin.normalisation()).isEqualTo(original.normalisation());
  }

  @Test
  void modelReadBackFromFilesStillSumsToOne() {
    // Normalisation (mathematical invariant): Σ_w P(w | h) = 1 over all words, </s> and <unk> (not <s>), for
    // seen and unseen histories; 1e-5 for a model that went through 7-digit ARPA and float binary storage.
    BackoffModel original = TinyKatzModel.train(TRAIN, 3);
    ModelFiles.save(original, dir.resolve("m.arpa"));
    ModelFiles.save(ModelFiles.loadExact(dir.resolve("m.arpa")), dir.resolve("m.bin"));
    for (LanguageModel lm : List.of(original, ModelFiles.load(dir.resolve("m.arpa")), ModelFiles.load(dir.resolve("m.bin")))) {
      for (String history : List.of("", "ten", "ten crates", "crates of", "of apples", "plums crates", "to bay", "bay four")) {
        LmState s = lm.newState();
        lm.beginSentence(s);
        for (String w : history.isEmpty() ? new String[0] : history.split(" ")) lm.score(s, lm.wordId(w), s);
        double sum = 0;
        LmState t = lm.newState();
        for (int id = 0; id < lm.vocabularySize(); id++) {
          if (id == lm.sentenceStartId()) continue;
          sum += Math.exp(lm.score(s, id, t));
        }
        assertThat(sum).as("history '%s' in %s", history, lm.getClass().getSimpleName()).isCloseTo(1.0, within(1e-5));
      }
    }
  }

  static double[] tokenScores(LanguageModel lm, String sentence) {
    String[] w = sentence.split(" ");
    double[] out = new double[w.length + 1];
    LmState s = lm.newState();
    lm.beginSentence(s);
    for (int i = 0; i < w.length; i++) out[i] = lm.score(s, lm.wordId(w[i]), s) / Math.log(10);
    out[w.length] = lm.score(s, lm.sentenceEndId(), s) / Math.log(10);
    return out;
  }
}
