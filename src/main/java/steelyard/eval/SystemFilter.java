package steelyard.eval;

import java.util.ArrayList;
import java.util.Iterator;
import java.util.List;
import java.util.NoSuchElementException;
import java.util.Set;
import java.util.TreeSet;
import java.nio.file.Path;
import steelyard.io.InputException;
import steelyard.io.Messages;
import steelyard.io.Hypothesis;
import steelyard.io.UtteranceHypotheses;

/**
 * A view of a hypotheses stream restricted to one system (one {@code system} column value), for comparing
 * systems that share one file. Each utterance keeps only that system's rows, in file order; its recogniser
 * pick becomes that system's smallest rank (ties: the earlier row). Utterances where the system has no row are
 * skipped, so they show up as missing hypotheses. Streams like its source; not thread-safe.
 */
public final class SystemFilter implements Iterator<UtteranceHypotheses> {
  /** At most this many distinct system names are remembered for the message of {@link #requireSeen}. */
  private static final int MAX_LISTED = 50;

  private final Iterator<UtteranceHypotheses> source;
  private final String system;
  private final Set<String> present = new TreeSet<>();
  private boolean matched;
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

  /**
   * After the source is exhausted: an {@link InputException} naming the systems present when the system never
   * occurred (every utterance would count as missing: a wrong answer, not a result). {@code option} and
   * {@code file} name the option and the file in the message.
   */
  public void requireSeen(String option, Path file) {
    if (matched) return;
    String names = present.isEmpty() || present.equals(Set.of("")) ? "none (the file has no system values)"
        : String.join(", ", present);
    throw InputException.option(option, "system '" + Messages.shown(system, 40) + "' does not occur in " + file,
        "one of the systems present: " + Messages.shown(names, 200));
  }

  private UtteranceHypotheses restrict(UtteranceHypotheses u) {
    List<Hypothesis> kept = new ArrayList<>();
    int pick = -1;
    for (Hypothesis h : u.hypotheses()) {
      if (present.size() < MAX_LISTED) present.add(h.system());
      if (!h.system().equals(system)) continue;
      matched = true;
      if (pick < 0 || h.rank() < kept.get(pick).rank()) pick = kept.size();
      kept.add(h);
    }
    return kept.isEmpty() ? null : new UtteranceHypotheses(u.uttId(), kept, pick);
  }
}
