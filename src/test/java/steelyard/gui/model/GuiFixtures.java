package steelyard.gui.model;

import java.io.BufferedWriter;
import java.io.IOException;
import java.nio.file.Files;
import java.nio.file.Path;
import java.util.List;
import java.util.Locale;
import java.util.Map;
import java.util.TreeMap;
import steelyard.io.HypothesesReader;
import steelyard.io.ImportOptions;
import steelyard.io.SyntheticHypotheses;

/** Seeded invented inputs for the window's view-model tests, from the project's own generator. */
public final class GuiFixtures {
  private GuiFixtures() {}

  /**
   * Writes {@code utterances} utterances of six hypotheses each ({@link SyntheticHypotheses}: columns
   * utt_id,rank,text,acoustic,lm) and references taken from another seed's sentences, so that errors are not
   * zero; every 7th utterance has no reference, and one extra reference ({@code orphan}) has no hypotheses.
   */
  public static void writeRandomSet(Path hyps, Path refs, long seed, int utterances) throws IOException {
    SyntheticHypotheses.write(hyps, utterances * 6L, 6, seed);
    writeReferences(hyps, refs, seed + 1, utterances, true);
  }

  /**
   * References for the utterances of {@code hyps}: the sentences of seed {@code seed} of the same generator, so
   * they differ from the hypotheses; with {@code gaps}, every 7th utterance has none and an extra one
   * ({@code orphan}) has no hypotheses.
   */
  public static void writeReferences(Path hyps, Path refs, long seed, int utterances, boolean gaps) throws IOException {
    Path other = refs.resolveSibling(refs.getFileName() + ".source.csv");
    SyntheticHypotheses.write(other, utterances, 1, seed);
    try (BufferedWriter w = Files.newBufferedWriter(refs); HypothesesReader a = HypothesesReader.open(hyps, ImportOptions.strict(List.of()));
        HypothesesReader b = HypothesesReader.open(other, ImportOptions.strict(List.of()))) {
      w.write("utt_id,text\n");
      for (int u = 0; a.hasNext() && b.hasNext(); u++) {
        String id = a.next().uttId();
        String text = b.next().first().text();
        if (!gaps || u % 7 != 3) w.write(id + "," + text + "\n");
        if (gaps && u == 0) w.write("orphan," + text + "\n");
      }
    }
    Files.delete(other);
  }

  /** A unigram model of the words of {@code refs} (log10 of relative frequencies), as ARPA text. */
  public static void writeTinyModel(Path refs, Path arpa) throws IOException {
    Map<String, Integer> counts = new TreeMap<>();
    int total = 0;
    for (String line : Files.readAllLines(refs).subList(1, Files.readAllLines(refs).size())) {
      for (String w : line.substring(line.indexOf(',') + 1).split(" ")) {
        counts.merge(w, 1, Integer::sum);
        total++;
      }
    }
    StringBuilder sb = new StringBuilder("\\data\\\nngram 1=" + (counts.size() + 3) + "\n\n\\1-grams:\n");
    sb.append("-99\t<s>\t0\n-1\t</s>\n-3\t<unk>\n");
    for (Map.Entry<String, Integer> e : counts.entrySet()) {
      sb.append(String.format(Locale.ROOT, "%.4f\t%s%n", Math.log10((double) e.getValue() / total) - 0.1, e.getKey()));
    }
    Files.writeString(arpa, sb.append("\n\\end\\\n"));
  }
}
