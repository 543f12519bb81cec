package steelyard.eval;

import java.util.ArrayList;
import java.util.Iterator;
import java.util.List;
import java.util.NoSuchElementException;
import steelyard.io.Hypothesis;
import steelyard.io.UtteranceHypotheses;

/**
 * A view of a hypotheses stream restricted to one system (one {@code system} column value), for comparing
 * systems that share one file. Each utterance keeps only that system's rows, in file order; its recogniser
 * pick becomes that system's smallest rank (ties: the earlier row). Utterances where the system has no row are
 * skipped, so they show up as missing hypotheses. Streams like its source; not thread-safe.
 */
public final class SystemFilter implements Iterator<UtteranceHypotheses> {
  private final Iterator<UtteranceHypotheses> source;
  private final String system;
  private UtteranceHypotheses next;

  public SystemFilter(Iterator<UtteranceHypotheses> source, String system) {
    this.source = source;
    this.system = system;
  }

  @Override
  public boolean hasNext() {
    while (next == null && source.hasNext()) next = restrict(source.next());
    return next != null;
  }

  @Override
  public UtteranceHypotheses next() {
    if (!hasNext()) throw new NoSuchElementException();
    UtteranceHypotheses u = next;
    next = null;
    return u;
  }

  private UtteranceHypotheses restrict(UtteranceHypotheses u) {
    List<Hypothesis> kept = new ArrayList<>();
    int pick = -1;
    for (Hypothesis h : u.hypotheses()) {
      if (!h.system().equals(system)) continue;
      if (pick < 0 || h.rank() < kept.get(pick).rank()) pick = kept.size();
      kept.add(h);
    }
    return kept.isEmpty() ? null : new UtteranceHypotheses(u.uttId(), kept, pick);
  }
}
