package steelyard.rescore;

import com.fasterxml.jackson.databind.node.ArrayNode;
import com.fasterxml.jackson.databind.node.JsonNodeFactory;
import com.fasterxml.jackson.databind.node.ObjectNode;
import it.unimi.dsi.fastutil.ints.IntArrayList;
import java.util.ArrayList;
import java.util.List;
import steelyard.eval.Bootstrap;
import steelyard.eval.EditCounts;
import steelyard.eval.PairedComparison;
import steelyard.io.JsonOutput;

/**
 * Accumulates a rescoring run in input order (so the totals do not depend on the thread count) and renders
 * the JSON summary. With references, the error keys are those of the {@code score} command plus
 * {@code first_error_rate}, {@code oracle_error_rate}, {@code lattice_oracle_error_rate} (network methods)
 * and {@code changed}; {@link #versusFirstJson} renders the paired test of the choice against rank 1.
 *
 * <p>For the methods that use posteriors (MBR and the network methods) it counts the utterances in which a
 * system has at least two kept hypotheses, and among them those where, in every such system, one hypothesis
 * holds more than {@value #COLLAPSED_MASS} of that system's mass (α scales totals within a system; systems are
 * then mixed by their weights). When that is most of them the posteriors have collapsed to 0 or 1 and the
 * method degenerates to each system's best total ({@link #warnings()}).
 *
 * <p>Per scored utterance it keeps three ints (errors of the choice and of rank 1, reference tokens) for the
 * bootstrap and the paired test, 12 bytes per utterance in three {@link IntArrayList}s, and a reference to its id
 * (shared with the imported rows) for the run history.
 */
public final class RescoreSummary {
  /** Printed with every result: an automatic pick is a statistical choice. */
  public static final String NOTICE = "An automatic pick is not a verified transcript: transcripts with legal, "
      + "medical or safety weight need review by a person.";

  /** Rates and interval ends are written with this many decimals, as by the {@code score} command. */
  public static final int RATE_DIGITS = 6;

  /** A hypothesis holding more than this share of an utterance's posterior mass counts as a collapse. */
  public static final double COLLAPSED_MASS = 0.999;

  /** Significant digits of a p-value in the JSON. */
  private static final int P_DIGITS = 10;

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
  private long posteriorUtterances;
  private long collapsed;
  private final IntArrayList errorsPerUtterance = new IntArrayList();
  private final IntArrayList firstErrorsPerUtterance = new IntArrayList();
  private final IntArrayList tokensPerUtterance = new IntArrayList();
  private final List<String> scoredIds = new ArrayList<>();
  private List<String> referenceOrder = List.of();
  private final List<String> missingHypotheses = new ArrayList<>();
  private final List<String> missingReferences = new ArrayList<>();
  private final List<String> notes = new ArrayList<>();

  /** Adds one rescored utterance; {@code errors} is null when it has no reference (or none were given). */
  public void add(UtteranceResult r, UtteranceErrors errors) {
    utterances++;
    hypotheses += r.scores().size();
    if (r.changed()) changed++;
    if (r.isNewTranscript()) newTranscripts++;
    if (r.capped()) capped++;
    int state = r.method() == RescoreMethod.NBEST ? -1 : collapseState(r);
    if (state >= 0) posteriorUtterances++;
    if (state > 0) collapsed++;
    if (errors != null) {
      scoredIds.add(r.uttId());
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
    scoredIds.add(uttId);
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
    firstErrorsPerUtterance.add(Math.toIntExact(f.errors()));
    tokensPerUtterance.add(Math.toIntExact(c.referenceTokens()));
  }

  /** Records the ids of the references file in file order (the order a run history stores utterances in). */
  public void referenceOrder(java.util.Collection<String> ids) {
    referenceOrder = List.copyOf(ids);
  }

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
  /** Ids of the scored utterances, in the order of {@link #errorsPerUtterance()}. */
  public List<String> scoredIds() { return java.util.Collections.unmodifiableList(scoredIds); }
  /** Ids of the utterances with hypotheses but no reference, in input order. */
  public List<String> missingReferenceIds() { return java.util.Collections.unmodifiableList(missingReferences); }
  /** Ids of the references without hypotheses, in reference-file order. */
  public List<String> missingHypothesisIds() { return java.util.Collections.unmodifiableList(missingHypotheses); }
  /** The references file's ids in file order, when the run was given them ({@link #referenceOrder}); else empty. */
  public List<String> referenceOrder() { return referenceOrder; }
  /** Per scored utterance: reference tokens. */
  public int[] referenceTokensPerUtterance() { return tokensPerUtterance.toIntArray(); }
  /** Per scored utterance: errors of the recogniser's rank 1. */
  public int[] firstErrorsPerUtterance() { return firstErrorsPerUtterance.toIntArray(); }
  /** Utterances where a system has at least two kept hypotheses, rescored by a method that uses posteriors. */
  public long posteriorUtterances() { return posteriorUtterances; }
  /** Of those, the utterances where one hypothesis holds more than {@value #COLLAPSED_MASS} of each such system's mass. */
  public long collapsedUtterances() { return collapsed; }

  /** Whether the posteriors collapsed in most (more than half) of the utterances where they matter. */
  public boolean posteriorsCollapsed() {
    return posteriorUtterances > 0 && 2 * collapsed > posteriorUtterances;
  }

  /** Records a warning about the run found after it (e.g. few utterances shared with the references). */
  public void warn(String warning) {
    notes.add(warning);
  }

  /** Warnings about the run itself: those recorded by {@link #warn}, in order, then collapsed posteriors. */
  public List<String> warnings() {
    List<String> out = new ArrayList<>(notes);
    if (posteriorsCollapsed()) {
      out.add("posteriors are nearly all 0 or 1 (in " + collapsed + " of " + posteriorUtterances
          + " utterances one hypothesis holds more than " + COLLAPSED_MASS
          + " of its system's mass); tune α (the posterior sharpness), or pass --posterior-sharpness");
    }
    return List.copyOf(out);
  }

  /** The 95 % bootstrap interval of the chosen error rate over the scored utterances ({@link Bootstrap#corpusRate}). */
  public Bootstrap.Interval interval(int resamples, long seed, int threads) {
    return Bootstrap.corpusRate(errorsPerUtterance(), referenceTokensPerUtterance(), resamples, seed, threads);
  }

  /**
   * The paired test of the choice (B) against the recogniser's rank 1 (A) over the scored utterances: paired
   * bootstrap of the rate difference and the exact sign test ({@link PairedComparison}).
   */
  public PairedComparison versusFirst(int resamples, long seed, int threads) {
    return PairedComparison.of(firstErrorsPerUtterance(), errorsPerUtterance(), referenceTokensPerUtterance(), resamples, seed, threads);
  }

  /**
   * The JSON of {@link #versusFirst}: utterances where the choice has fewer errors than rank 1 ({@code better}),
   * more ({@code worse}) or as many ({@code tied}); the rate difference choice − rank 1 with its paired-bootstrap
   * 95 % interval; the share of resamples in which each is better; the two-sided sign-test p-value.
   */
  public static ObjectNode versusFirstJson(PairedComparison c) {
    ObjectNode o = JsonNodeFactory.instance.objectNode();
    o.put("utterances", c.utterances());
    o.put("better", c.bBetter());
    o.put("worse", c.aBetter());
    o.put("tied", c.ties());
    finite(o, "error_rate_difference", c.difference());
    finite(o, "difference_ci95_low", c.paired().difference().low());
    finite(o, "difference_ci95_high", c.paired().difference().high());
    finite(o, "prob_better", c.paired().probBBetter());
    finite(o, "prob_worse", c.paired().probABetter());
    o.put("sign_test_p", JsonOutput.significant(c.signTestP(), P_DIGITS));
    return o;
  }

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
    if (Double.isFinite(v)) o.put(key, JsonOutput.fixed(v, RATE_DIGITS)); else o.putNull(key);
  }

  /** −1: no system has two kept hypotheses; 1: every system that has holds > {@value #COLLAPSED_MASS} in one; 0: otherwise. */
  private static int collapseState(UtteranceResult r) {
    ScoredUtterance s = r.scores();
    int k = s.systems().size();
    double[] sum = new double[k];
    double[] max = new double[k];
    int[] count = new int[k];
    for (int i = 0; i < s.size(); i++) {
      int sys = s.systemIndex(i);
      double p = r.posteriors()[i];
      sum[sys] += p;
      max[sys] = Math.max(max[sys], p);
      count[sys]++;
    }
    int state = -1;
    for (int sys = 0; sys < k; sys++) {
      if (count[sys] < 2) continue;
      if (!(max[sys] > COLLAPSED_MASS * sum[sys])) return 0;
      state = 1;
    }
    return state;
  }

  private static void rate(ObjectNode o, String key, long errors, long n) {
    finite(o, key, n == 0 ? Double.NaN : (double) errors / n);
  }
}
