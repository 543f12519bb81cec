package steelyard.lm.train;

import java.util.ArrayList;
import java.util.Arrays;
import java.util.List;
import java.util.SplittableRandom;
import steelyard.lm.LanguageModel;
import steelyard.lm.LmState;

/** Corpus generation and probability look-ups shared by the trainer's tests. */
final class TrainTestSupport {
  private TrainTestSupport() {}

  /** A seeded corpus over {@code w0 … w(vocab−1)}, skewed so that counts of 1 … 4 all occur. */
  static List<List<String>> randomCorpus(SplittableRandom random, int sentences, int vocab, int maxLength) {
    List<List<String>> corpus = new ArrayList<>();
    for (int i = 0; i < sentences; i++) {
      int n = 1 + random.nextInt(maxLength);
      List<String> s = new ArrayList<>();
      for (int j = 0; j < n; j++) {
        int a = random.nextInt(vocab), b = random.nextInt(vocab);
        s.add("w" + Math.min(a, b));
      }
      corpus.add(s);
    }
    return corpus;
  }

  static List<List<String>> corpus(String... lines) {
    List<List<String>> out = new ArrayList<>();
    for (String l : lines) out.add(l.isBlank() ? List.of() : Arrays.asList(l.trim().split(" +")));
    return out;
  }

  /** P(w | context) from any model through its state API, the context scored from an empty state. */
  static double prob(LanguageModel lm, List<String> context, String w) {
    LmState s = lm.newState();
    for (String c : context) lm.score(s, lm.wordId(c), s);
    return Math.exp(lm.score(s, lm.wordId(w), lm.newState()));
  }

  /** The tokens a model predicts: every id except {@code <s>}. */
  static List<String> predicted(LanguageModel lm) {
    List<String> out = new ArrayList<>();
    for (int id = 0; id < lm.vocabularySize(); id++) if (id != lm.sentenceStartId()) out.add(lm.token(id));
    return out;
  }

  /** Random contexts: half starting with {@code <s>}, tokens drawn from {@code tokens} plus an unseen word. */
  static List<List<String>> randomContexts(SplittableRandom random, List<String> tokens, int count, int maxLength) {
    List<List<String>> out = new ArrayList<>();
    for (int i = 0; i < count; i++) {
      List<String> c = new ArrayList<>();
      if (random.nextBoolean()) c.add("<s>");
      int n = random.nextInt(maxLength + 1);
      for (int j = 0; j < n; j++) {
        String t = random.nextInt(8) == 0 ? "never-seen" : tokens.get(random.nextInt(tokens.size()));
        if (t.equals("</s>")) t = "<unk>";
        c.add(t);
      }
      out.add(c);
    }
    return out;
  }

  static double sum(LanguageModel lm, List<String> context) {
    double total = 0;
    for (String w : predicted(lm)) total += prob(lm, context, w);
    return total;
  }

  /** {@code o} with minimum counts {@code fromOrder2[0]} for order 2, {@code [1]} for order 3, …, up to its order. */
  static TrainingOptions minCounts(TrainingOptions o, int... fromOrder2) {
    for (int k = 2; k <= o.order() && k - 2 < fromOrder2.length; k++) o = o.withMinCount(k, fromOrder2[k - 2]);
    return o;
  }
}
