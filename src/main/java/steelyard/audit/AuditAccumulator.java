package steelyard.audit;

import it.unimi.dsi.fastutil.objects.Object2LongMap;
import it.unimi.dsi.fastutil.objects.Object2LongOpenHashMap;
import java.util.ArrayList;
import java.util.List;
import java.util.Map;
import java.util.TreeMap;
import steelyard.eval.TokenTally;
import steelyard.rescore.RescoreMethod;
import steelyard.rescore.ScoredUtterance;
import steelyard.rescore.UtteranceResult;
import steelyard.text.TokenSequence;

/**
 * Sums audited utterances, in input order, into an {@link AuditReport}: the overrules, their counts for the run
 * and per group, and the run's errors of rank 1 and of the picks over every utterance with a reference (counted
 * as rescoring's reference scorer counts them). Keeps the overrules plus, per group, a map of token pairs. Not
 * thread-safe; audit on several threads if needed, then add here in order.
 */
public final class AuditAccumulator {
  private final AuditSettings settings;
  private final ErrorPairs errors = new ErrorPairs();
  private final List<Overrule> overrules = new ArrayList<>();
  private final Tally total = new Tally();
  private final Map<String, Tally> groups = new TreeMap<>();
  private RescoreMethod method;
  private long utterances;
  private long verified;
  private long referenceTokens;
  private long firstErrors;
  private long chosenErrors;

  AuditAccumulator(AuditSettings settings) {
    this.settings = settings;
  }

  /** Adds one utterance and its overrule ({@link OverruleAuditor#audit}; null when the pick is rank 1's transcript). */
  public void add(AuditInput in, Overrule o) {
    UtteranceResult r = in.result();
    utterances++;
    if (method == null) method = r.method();
    if (in.reference() != null) corpus(in, o);
    if (o == null) return;
    overrules.add(o);
    total.add(o);
    groups.computeIfAbsent(o.group(), g -> new Tally()).add(o);
  }

  private void corpus(AuditInput in, Overrule o) {
    TokenSequence ref = in.reference();
    verified++;
    for (boolean optional : ref.optional()) if (!optional) referenceTokens++;
    if (o != null) {
      firstErrors += o.first().errors();
      chosenErrors += o.pick().errors();
      return;
    }
    UtteranceResult r = in.result();
    ScoredUtterance s = r.scores();
    int first = s.firstIndex();
    long fe = errors.count(s, ref, first, null);
    firstErrors += fe;
    chosenErrors += r.chosen() == first ? fe : errors.count(s, ref, r.chosen(), r.newTokens());
  }

  /** The report of everything added so far. */
  public AuditReport finish() {
    List<AuditCounts> perGroup = new ArrayList<>(groups.size());
    for (Map.Entry<String, Tally> e : groups.entrySet())
      perGroup.add(e.getValue().counts(e.getKey(), settings.topPairs()));
    return new AuditReport(method, settings.unit(), settings.featureNames(), utterances, verified, referenceTokens,
        firstErrors, chosenErrors, total.counts(null, settings.topPairs()), perGroup, overrules);
  }

  /** Counts and token pairs of one set of overrules. */
  private static final class Tally {
    long overrules;
    final long[] verdicts = new long[Verdict.values().length];
    long net;
    final Object2LongOpenHashMap<TokenTally> fixed = new Object2LongOpenHashMap<>();
    final Object2LongOpenHashMap<TokenTally> broken = new Object2LongOpenHashMap<>();

    void add(Overrule o) {
      overrules++;
      verdicts[o.verdict().ordinal()]++;
      net += o.errorChange();
      for (TokenTally t : o.fixed()) fixed.addTo(new TokenTally(t.ref(), t.hyp(), 0), t.count());
      for (TokenTally t : o.broken()) broken.addTo(new TokenTally(t.ref(), t.hyp(), 0), t.count());
    }

    AuditCounts counts(String group, int top) {
      return new AuditCounts(group, overrules, verdicts[Verdict.HELPED.ordinal()], verdicts[Verdict.HURT.ordinal()],
          verdicts[Verdict.NEUTRAL.ordinal()], verdicts[Verdict.UNVERIFIED.ordinal()], net, top(fixed, top),
          top(broken, top));
    }

    private static List<TokenTally> top(Object2LongOpenHashMap<TokenTally> pairs, int k) {
      List<TokenTally> all = new ArrayList<>(pairs.size());
      for (Object2LongMap.Entry<TokenTally> e : pairs.object2LongEntrySet())
        all.add(new TokenTally(e.getKey().ref(), e.getKey().hyp(), e.getLongValue()));
      all.sort(ErrorPairs.ORDER);
      return List.copyOf(all.subList(0, Math.min(k, all.size())));
    }
  }
}
