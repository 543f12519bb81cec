package steelyard.gui.model;

import java.io.IOException;
import java.nio.file.Files;
import java.nio.file.Path;
import java.util.ArrayList;
import java.util.List;
import java.util.Locale;
import java.util.SplittableRandom;

/** Small seeded invented inputs for the window's view-model tests, and the project folder with the demo data. */
public final class GuiFixtures {
  private static final String[] WORDS = {"ten", "crates", "of", "pears", "bay", "nine", "load", "the", "leeks", "cold", "store"};

  private GuiFixtures() {}

  /** The project root (where sample-hypotheses/ and models/ are). */
  public static Path projectRoot() {
    return Path.of("").toAbsolutePath();
  }

  /**
   * Writes {@code utterances} utterances of 1–6 hypotheses (columns utt_id,rank,text,acoustic,conf,group; conf a
   * 0–1 confidence), garbled from a random reference; every 7th utterance has no reference and one extra
   * reference has no hypotheses.
   */
  public static void writeRandomSet(Path hyps, Path refs, long seed, int utterances) throws IOException {
    SplittableRandom rnd = new SplittableRandom(seed);
    StringBuilder h = new StringBuilder("utt_id,rank,text,acoustic,conf,group\n");
    StringBuilder r = new StringBuilder("utt_id,text,group\n");
    for (int u = 0; u < utterances; u++) {
      String id = String.format(Locale.ROOT, "u%03d", u);
      String group = "g" + (u % 3);
      List<String> ref = new ArrayList<>();
      int len = 2 + rnd.nextInt(7);
      for (int k = 0; k < len; k++) ref.add(WORDS[rnd.nextInt(WORDS.length)]);
      if (u % 7 != 3) r.append(id).append(',').append(String.join(" ", ref)).append(',').append(group).append('\n');
      int n = 1 + rnd.nextInt(6);
      double ac = -10 * len;
      for (int rank = 1; rank <= n; rank++) {
        ac -= rnd.nextDouble() * 4;
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
        h.append(id).append(',').append(rank).append(',').append(String.join(" ", t)).append(',')
            .append(String.format(Locale.ROOT, "%.3f", ac)).append(',')
            .append(String.format(Locale.ROOT, "%.3f", 0.05 + 0.9 * rnd.nextDouble())).append(',').append(group).append('\n');
      }
    }
    r.append("orphan,ten crates of pears,g9\n");
    Files.writeString(hyps, h);
    Files.writeString(refs, r);
  }

  /** A word bigram model as ARPA text over the fixture's words (log10 values, hand-written). */
  public static void writeTinyModel(Path arpa) throws IOException {
    StringBuilder sb = new StringBuilder("\\data\\\nngram 1=" + (WORDS.length + 3) + "\n\n\\1-grams:\n");
    sb.append("-99\t<s>\t-0.3\n-1.0\t</s>\n-2.0\t<unk>\n");
    for (int i = 0; i < WORDS.length; i++) sb.append(String.format(Locale.ROOT, "%.2f\t%s\t-0.2%n", -0.8 - 0.05 * i, WORDS[i]));
    sb.append("\n\\end\\\n");
    Files.writeString(arpa, sb);
  }
}
