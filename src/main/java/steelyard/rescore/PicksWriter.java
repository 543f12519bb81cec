package steelyard.rescore;

import java.io.IOException;
import java.util.ArrayList;
import java.util.List;
import steelyard.io.CsvWriter;
import steelyard.io.Hypothesis;
import steelyard.lattice.LatticeChoice;
import steelyard.text.Normaliser;
import steelyard.text.Unit;

/**
 * Writes {@code picks.csv} (one row per utterance: the choice and its score breakdown) and the optional
 * breakdown file (one row per kept hypothesis), both data outputs meant for re-import: raw text exactly
 * (write them through {@link CsvWriter#plain}).
 * Columns are documented in the README; {@code feature.NAME} columns follow the selected features.
 */
public final class PicksWriter {
  private final List<String> featureNames;
  private final Unit unit;

  public PicksWriter(List<String> featureNames, Unit unit) {
    this.featureNames = List.copyOf(featureNames);
    this.unit = unit;
  }

  public void picksHeader(CsvWriter out) throws IOException {
    List<String> h = new ArrayList<>(List.of("utt_id", "system", "rank", "method", "text", "new_transcript", "changed", "capped",
        "total", "posterior"));
    termColumns(h);
    h.addAll(List.of("mbr_expected_errors", "path_score", "path_ln_posterior", "path_lm_ln_prob"));
    out.row(h);
  }

  public void breakdownHeader(CsvWriter out) throws IOException {
    List<String> h = new ArrayList<>(List.of("utt_id", "system", "rank", "text", "chosen", "total", "posterior"));
    termColumns(h);
    out.row(h);
  }

  private void termColumns(List<String> h) {
    for (String f : featureNames) h.add("feature." + f);
    h.addAll(List.of("lm_term", "oov_term", "length_term", "lm_ln_prob", "oov_tokens", "tokens"));
  }

  public void pick(CsvWriter out, UtteranceResult r) throws IOException {
    List<String> row = new ArrayList<>(10 + featureNames.size() + 10);
    Hypothesis h = r.chosenHypothesis();
    row.add(r.uttId());
    row.add(h == null ? "" : h.system());
    row.add(h == null ? "" : Integer.toString(h.rank()));
    row.add(r.method().label());
    row.add(h == null ? join(r.newTokens(), unit) : h.text());
    row.add(Boolean.toString(r.isNewTranscript()));
    row.add(Boolean.toString(r.changed()));
    row.add(Boolean.toString(r.capped()));
    if (h == null) {
      for (int k = 0; k < featureNames.size() + 8; k++) row.add("");
      row.set(row.size() - 1, Integer.toString(r.newTokens().size()));
    } else {
      row.add(CsvWriter.number(r.totals()[r.chosen()]));
      row.add(CsvWriter.number(r.posteriors()[r.chosen()]));
      terms(row, r, r.chosen());
    }
    row.add(r.mbr() == null ? "" : CsvWriter.number(r.mbr().expectedErrors()));
    LatticeChoice c = r.lattice();
    row.add(c == null ? "" : CsvWriter.number(c.score()));
    row.add(c == null ? "" : CsvWriter.number(c.logPosterior()));
    row.add(c == null ? "" : CsvWriter.number(c.lmLogProb()));
    out.row(row);
  }

  /** One row per kept hypothesis of {@code r}, in file order. */
  public void breakdown(CsvWriter out, UtteranceResult r) throws IOException {
    ScoredUtterance s = r.scores();
    List<String> row = new ArrayList<>(10 + featureNames.size() + 6);
    for (int i = 0; i < s.size(); i++) {
      row.clear();
      Hypothesis h = s.hypothesis(i);
      row.add(r.uttId());
      row.add(h.system());
      row.add(Integer.toString(h.rank()));
      row.add(h.text());
      row.add(i == r.chosen() ? "1" : "0");
      row.add(CsvWriter.number(r.totals()[i]));
      row.add(CsvWriter.number(r.posteriors()[i]));
      terms(row, r, i);
      out.row(row);
    }
  }

  private void terms(List<String> row, UtteranceResult r, int i) {
    ScoredUtterance s = r.scores();
    LogLinear w = r.weighting();
    int f = featureNames.size();
    for (int t = 0; t < f + 3; t++) row.add(CsvWriter.number(w.term(s, i, t)));
    row.add(CsvWriter.number(s.lmLogProb(i)));
    row.add(Integer.toString(s.oovCount(i)));
    row.add(Integer.toString(s.tokenCount(i)));
  }

  /**
   * Joins tokens of a new transcript as the unit requires: words with single spaces; characters concatenated,
   * with the space token turned back into a space.
   */
  public static String join(List<String> tokens, Unit unit) {
    return Normaliser.join(tokens, unit);
  }
}
