package steelyard.rescore;

import com.fasterxml.jackson.databind.node.ArrayNode;
import com.fasterxml.jackson.databind.node.JsonNodeFactory;
import com.fasterxml.jackson.databind.node.ObjectNode;
import it.unimi.dsi.fastutil.ints.IntArrayList;
import java.math.BigDecimal;
import java.math.RoundingMode;
import java.util.ArrayList;
import java.util.List;
import steelyard.eval.EditCounts;

/**
 * Accumulates a rescoring run in input order (so the totals do not depend on the thread count) and renders
 * the JSON summary. With references, the error keys are those of the {@code score} command plus
 * {@code first_error_rate}, {@code oracle_error_rate}, {@code lattice_oracle_error_rate} (network methods)
 * and {@code changed}.
 *
 * <p>Per scored utterance it keeps two ints (errors, reference tokens of the choice) for the bootstrap:
 * 8 bytes per utterance in two {@link IntArrayList}s.
 */
public final class RescoreSummary {
  /** Printed with every result: an automatic pick is a statistical choice. */
  public static final String NOTICE = "An automatic pick is not a verified transcript: transcripts with legal, "
      + "medical or safety weight need review by a person.";

  /** Rates and interval ends are written with this many decimals, as by the {@code score} command. */
  public static final int RATE_DIGITS = 6;

  private long utterances;
  private long hypotheses;
  private long changed;
  private long newTranscripts;
  private long capped;
  private long scored;
  private EditCounts chosen = EditCounts.ZERO;
  private EditCounts first = EditCounts.ZERO;
  private EditCounts oracle = EditCounts.ZERO;
  private long latticeOracleErrors;
  private boolean latticeOracle;
  private long sentenceErrors;
  private final IntArrayList errorsPerUtterance = new IntArrayList();
  private final IntArrayList tokensPerUtterance = new IntArrayList();
  private final List<String> missingHypotheses = new ArrayList<>();
  private final List<String> missingReferences = new ArrayList<>();

  /** Adds one rescored utterance; {@code errors} is null when it has no reference (or none were given). */
  public void add(UtteranceResult r, UtteranceErrors errors) {
    utterances++;
    hypotheses += r.scores().size();
    if (r.changed()) changed++;
    if (r.isNewTranscript()) newTranscripts++;
    if (r.capped()) capped++;
    if (errors != null) {
      addScored(errors.chosen(), errors.first(), errors.oracle());
      if (errors.latticeOracle() >= 0) {
        latticeOracle = true;
        latticeOracleErrors += errors.latticeOracle();
      }
    }
  }

  /** Records a hypotheses utterance that has no reference. */
  public void missingReference(String uttId) {
    missingReferences.add(uttId);
  }

  /** Records a reference with no hypotheses: every reference token deleted, in every rate. */
  public void missingHypotheses(String uttId, EditCounts allDeleted) {
    missingHypotheses.add(uttId);
    addScored(allDeleted, allDeleted, allDeleted);
    latticeOracleErrors += allDeleted.errors();
  }

  private void addScored(EditCounts c, EditCounts f, EditCounts o) {
    scored++;
    chosen = chosen.plus(c);
    first = first.plus(f);
    oracle = oracle.plus(o);
    if (c.errors() > 0) sentenceErrors++;
    errorsPerUtterance.add(Math.toIntExact(c.errors()));
    tokensPerUtterance.add(Math.toIntExact(c.referenceTokens()));
  }

  /** Ids of references with no hypotheses, in the order recorded. */
  public List<String> missingHypothesisIds() { return List.copyOf(missingHypotheses); }
  /** Ids of hypothesis utterances with no reference, in input order. */
  public List<String> missingReferenceIds() { return List.copyOf(missingReferences); }
  public long utterances() { return utterances; }
  public long changed() { return changed; }
  public long newTranscripts() { return newTranscripts; }
  public long cappedUtterances() { return capped; }
  public EditCounts chosen() { return chosen; }
  public EditCounts first() { return first; }
  public EditCounts oracle() { return oracle; }
  public long scored() { return scored; }
  /** Per scored utterance (input order, then missing hypotheses): errors of the choice. */
  public int[] errorsPerUtterance() { return errorsPerUtterance.toIntArray(); }
  /** Per scored utterance: reference tokens. */
  public int[] referenceTokensPerUtterance() { return tokensPerUtterance.toIntArray(); }

  /**
   * The JSON summary.
   *
   * @param withReferences whether references were given (adds the error keys)
   * @param ci95           the bootstrap interval {low, high} of the chosen error rate, or null when not computed
   */
  public ObjectNode toJson(String method, String unit, long seed, boolean withReferences, double[] ci95) {
    JsonNodeFactory f = JsonNodeFactory.instance;
    ObjectNode o = f.objectNode();
    o.put("notice", NOTICE);
    o.put("method", method);
    o.put("unit", unit);
    o.put("seed", seed);
    o.put("rescored_utterances", utterances);
    o.put("hypotheses", hypotheses);
    o.put("changed", changed);
    o.put("new_transcripts", newTranscripts);
    o.put("capped_utterances", capped);
    if (!withReferences) return o;
    o.put("utterances", scored);
    o.put("reference_tokens", chosen.referenceTokens());
    o.put("correct", chosen.correct());
    o.put("substitutions", chosen.substitutions());
    o.put("deletions", chosen.deletions());
    o.put("insertions", chosen.insertions());
    rate(o, "error_rate", chosen.errors(), chosen.referenceTokens());
    rate(o, "sentence_error_rate", sentenceErrors, scored);
    finite(o, "ci95_low", ci95 == null ? Double.NaN : ci95[0]);
    finite(o, "ci95_high", ci95 == null ? Double.NaN : ci95[1]);
    o.put("missing_hypotheses", missingHypotheses.size());
    o.put("missing_references", missingReferences.size());
    rate(o, "first_error_rate", first.errors(), first.referenceTokens());
    rate(o, "oracle_error_rate", oracle.errors(), oracle.referenceTokens());
    if (latticeOracle) rate(o, "lattice_oracle_error_rate", latticeOracleErrors, chosen.referenceTokens());
    ArrayNode mh = o.putArray("missing_hypothesis_ids");
    missingHypotheses.forEach(mh::add);
    ArrayNode mr = o.putArray("missing_reference_ids");
    missingReferences.forEach(mr::add);
    return o;
  }

  /** JSON has no NaN or infinity: an undefined value is null. */
  private static void finite(ObjectNode o, String key, double v) {
    if (Double.isFinite(v)) o.put(key, new BigDecimal(v).setScale(RATE_DIGITS, RoundingMode.HALF_EVEN)); else o.putNull(key);
  }

  private static void rate(ObjectNode o, String key, long errors, long n) {
    finite(o, key, n == 0 ? Double.NaN : (double) errors / n);
  }
}
