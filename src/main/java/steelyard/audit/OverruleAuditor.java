package steelyard.audit;

import java.util.List;
import steelyard.audit.ErrorPairs.Errors;
import steelyard.eval.TokenTally;
import steelyard.io.Hypothesis;
import steelyard.rescore.RescoreMethod;
import steelyard.rescore.ScoredUtterance;
import steelyard.rescore.UtteranceResult;
import steelyard.text.Normaliser;
import steelyard.text.TokenSequence;

/**
 * The overrule audit: for every utterance whose pick differs from the recogniser's rank 1, the verdict against
 * the reference, the score terms of both side by side, how close the call was along the LM weight, and the
 * n-grams that decided the LM difference; then counts per run and per group, tied to the corpus error totals.
 *
 * <pre>{@code
 * OverruleAuditor auditor = new OverruleAuditor(AuditSettings.of(features, Unit.WORD, lm, lmTokens, null));
 * AuditReport report = auditor.auditAll(inputs);   // or, streaming:
 * AuditAccumulator acc = auditor.accumulator();
 * for (AuditInput in : inputs) acc.add(in, auditor.audit(in));
 * }</pre>
 *
 * <p>Rank 1 is {@link ScoredUtterance#firstIndex()}, the recogniser's own choice as rescoring's summary and
 * reference scorer use it, and an overrule is an utterance whose chosen tokens differ from rank 1's
 * ({@link UtteranceResult#changed()}), so the audit counts exactly the run's "changed" utterances.
 *
 * <p>Thread-safe: {@link #audit} may run on several threads at once (per-thread aligners), one utterance per
 * thread at a time (a {@link ScoredUtterance}'s token ids are built lazily).
 */
public final class OverruleAuditor {
  private final AuditSettings settings;
  private final ThreadLocal<ErrorPairs> errors = ThreadLocal.withInitial(ErrorPairs::new);
  private final ThreadLocal<NgramDiff> ngrams = ThreadLocal.withInitial(NgramDiff::new);

  public OverruleAuditor(AuditSettings settings) {
    this.settings = settings;
  }

  public AuditSettings settings() {
    return settings;
  }

  /** Audits every input in order. */
  public AuditReport auditAll(Iterable<AuditInput> inputs) {
    AuditAccumulator acc = accumulator();
    for (AuditInput in : inputs) acc.add(in, audit(in));
    return acc.finish();
  }

  /** A fresh accumulator for streaming use: add every audited utterance in input order, then finish. */
  public AuditAccumulator accumulator() {
    return new AuditAccumulator(settings);
  }

  /** The overrule of one utterance, or null when its pick has rank 1's tokens. */
  public Overrule audit(AuditInput in) {
    UtteranceResult r = in.result();
    if (!r.changed()) return null;
    ScoredUtterance s = r.scores();
    int first = s.firstIndex();
    TokenSequence ref = in.reference();
    Errors pe = null;
    Errors fe = null;
    if (ref != null) {
      ErrorPairs ep = errors.get();
      fe = ep.of(s, ref, first);
      pe = r.isNewTranscript() ? ep.ofNew(s, ref, r.newTokens()) : ep.of(s, ref, r.chosen());
    }
    Verdict verdict = ref == null ? Verdict.UNVERIFIED : Verdict.of(fe.errors(), pe.errors());
    List<TokenTally> fixed = ref == null ? List.of() : ErrorPairs.minus(fe, pe);
    List<TokenTally> broken = ref == null ? List.of() : ErrorPairs.minus(pe, fe);
    ScoreBreakdown breakdown =
        r.isNewTranscript() ? null : Breakdowns.of(r, settings.featureNames(), r.chosen(), first);
    NetworkAudit net = r.method().usesNetwork() ? new NetworkAudit(settings, r) : null;
    return new Overrule(r.uttId(), in.effectiveGroup(), r.method(), verdict, pickSide(r, pe), side(s, first, fe),
        ref == null ? null : Normaliser.join(ref.tokens(), settings.unit()), fixed, broken, breakdown,
        net == null ? null : net.paths(first), flip(r, net, first), decisive(r, first));
  }

  private FlipWeights flip(UtteranceResult r, NetworkAudit net, int first) {
    if (r.method() == RescoreMethod.NBEST) return Breakdowns.exactFlip(r, first);
    return net == null ? null : net.poolFlip(first, settings.poolSize());
  }

  /**
   * N-best and MBR: the raw texts in the model's tokenisation, whose ln P entered the totals. Network methods:
   * the network tokens, as the search scored them.
   */
  private DecisiveNgrams decisive(UtteranceResult r, int first) {
    if (settings.lm() == null) return null;
    ScoredUtterance s = r.scores();
    if (r.method().usesNetwork())
      return ngrams.get().compare(settings.lm(), "path", r.chosenTokens(), s.tokens(first).tokens());
    List<String> pick = settings.lmTokens().tokenize(r.chosenHypothesis().text()).tokens();
    List<String> rank1 = settings.lmTokens().tokenize(s.hypothesis(first).text()).tokens();
    return ngrams.get().compare(settings.lm(), "model", pick, rank1);
  }

  private Overrule.Side pickSide(UtteranceResult r, Errors e) {
    if (!r.isNewTranscript()) return side(r.scores(), r.chosen(), e);
    List<String> t = r.newTokens();
    return new Overrule.Side(-1, "", 0, Normaliser.join(t, settings.unit()), t, e == null ? -1 : e.errors());
  }

  private static Overrule.Side side(ScoredUtterance s, int i, Errors e) {
    Hypothesis h = s.hypothesis(i);
    return new Overrule.Side(i, h.system(), h.rank(), h.text(), s.tokens(i).tokens(), e == null ? -1 : e.errors());
  }
}
