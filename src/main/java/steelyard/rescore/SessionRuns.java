package steelyard.rescore;

import java.io.UncheckedIOException;
import java.nio.file.Path;
import java.util.ArrayList;
import java.util.HashSet;
import java.util.List;
import java.util.Map;
import java.util.Set;
import java.util.concurrent.CancellationException;
import java.util.function.BooleanSupplier;
import steelyard.io.HypothesesReader;
import steelyard.io.Reference;
import steelyard.io.UtteranceHypotheses;
import steelyard.text.TokenSequence;

/** The whole-file runs of {@link RescoreSession}: streaming ({@link #stream}) and into memory ({@link #load}). */
final class SessionRuns {
  private SessionRuns() {}

  static RescoreSummary stream(RescoreSession session, Path hyps, Map<String, Reference> references, int threads,
      RescoreSession.OutcomeSink sink) {
    RescoreSummary summary = new RescoreSummary();
    if (references != null) summary.referenceOrder(references.keySet());
    Set<String> seen = new HashSet<>();
    try (HypothesesReader reader = session.open(hyps)) {
      OrderedBatches.run(reader, u -> {
        UtteranceResult r = session.rescore(u);
        Reference ref = references == null ? null : references.get(u.uttId());
        return new UtteranceOutcome(r, ref == null ? null : session.errors(r, ref.text()));
      }, threads, OrderedBatches.DEFAULT_BATCH, o -> {
        if (references != null) seen.add(o.uttId());
        summary.add(o.result(), o.errors());
        if (references != null && o.errors() == null) summary.missingReference(o.uttId());
        sink.accept(o);
      });
    } catch (Exception e) {
      throw unchecked(e);
    }
    if (references != null) {
      for (Reference r : references.values())
        if (!seen.contains(r.uttId())) summary.missingHypotheses(r.uttId(), session.missingHypotheses(r.text()));
    }
    return summary;
  }

  static ScoredSet load(RescoreSession session, Path hyps, Map<String, Reference> references, int threads,
      RescoreSession.LoadListener listener, java.util.function.BooleanSupplier cancelled) {
    List<ScoredSet.Entry> entries = new ArrayList<>();
    List<String> missingReferences = new ArrayList<>();
    Set<String> seen = new HashSet<>();
    long[] hypotheses = {0};
    checkCancelled(cancelled);
    try (HypothesesReader reader = session.open(hyps)) {
      OrderedBatches.run(reader, u -> entry(session, u, references), threads, OrderedBatches.DEFAULT_BATCH, e -> {
        checkCancelled(cancelled);
        entries.add(e);
        hypotheses[0] += e.scores().size();
        if (references != null) {
          seen.add(e.uttId());
          if (e.reference() == null) missingReferences.add(e.uttId());
        }
        listener.loaded(entries.size(), hypotheses[0]);
      });
    } catch (Exception e) {
      throw unchecked(e);
    }
    List<ScoredSet.Missing> missing = new ArrayList<>();
    if (references != null) {
      for (Reference r : references.values())
        if (!seen.contains(r.uttId())) missing.add(new ScoredSet.Missing(r.uttId(), session.tokens(r.text()), r.group()));
    }
    return new ScoredSet(entries, missing, missingReferences, references != null, session.unit(), session.featureNames());
  }

  private static ScoredSet.Entry entry(RescoreSession session, UtteranceHypotheses u, Map<String, Reference> references) {
    Reference ref = references == null ? null : references.get(u.uttId());
    TokenSequence tokens = ref == null ? null : session.tokens(ref.text());
    String group = ref != null && !ref.group().isEmpty() ? ref.group() : u.first().group();
    return new ScoredSet.Entry(session.score(u), tokens, group);
  }

  private static void checkCancelled(BooleanSupplier cancelled) {
    if (cancelled.getAsBoolean()) throw new CancellationException("loading was cancelled");
  }

  private static RuntimeException unchecked(Exception e) {
    if (e instanceof RuntimeException) return (RuntimeException) e;
    if (e instanceof java.io.IOException) return new UncheckedIOException((java.io.IOException) e);
    return new IllegalStateException(e);
  }
}
