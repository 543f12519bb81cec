package steelyard.gui.model;

import java.util.ArrayList;
import java.util.Arrays;
import java.util.List;
import steelyard.lattice.ConfusionNetwork;

/**
 * A confusion network as the window draws it: slots left to right, each with its competing tokens and their
 * posteriors, and the arcs of the chosen transcript marked.
 *
 * @param slots the slots in order
 */
public record NetworkPicture(List<Slot> slots) {

  /** One competing token: its text (null for the empty arc), posterior (0 … 1) and whether the choice takes it. */
  public record Arc(String token, double posterior, int hypotheses, boolean chosen) {}

  /** One slot's arcs, highest posterior first. */
  public record Slot(List<Arc> arcs) {}

  /**
   * The picture of {@code net} with the path of {@code chosenTokens} marked: the path of the chosen
   * hypothesis ({@code chosenInput}, an input index, or −1) when it entered the network, otherwise a path
   * whose non-empty arcs spell the tokens (none is marked when no path does).
   */
  public static NetworkPicture of(ConfusionNetwork net, int chosenInput, List<String> chosenTokens) {
    int slots = net.slotCount();
    int[] path = chosenPath(net, chosenInput, chosenTokens);
    List<Slot> out = new ArrayList<>(slots);
    for (int s = 0; s < slots; s++) {
      List<Arc> arcs = new ArrayList<>();
      for (int a = net.arcStart(s); a < net.arcEnd(s); a++) {
        arcs.add(new Arc(net.arcText(a), net.arcPosterior(a), net.arcHypothesisCount(a), path != null && path[s] == a));
      }
      arcs.sort((x, y) -> Double.compare(y.posterior(), x.posterior()));
      out.add(new Slot(List.copyOf(arcs)));
    }
    return new NetworkPicture(List.copyOf(out));
  }

  /** Arc per slot of the chosen path, or null when none spells the tokens. */
  static int[] chosenPath(ConfusionNetwork net, int chosenInput, List<String> tokens) {
    int slots = net.slotCount();
    int k = chosenInput < 0 ? -1 : net.enteredIndexOf(chosenInput);
    if (k >= 0) {
      int[] path = new int[slots];
      for (int s = 0; s < slots; s++) path[s] = net.pathArc(k, s);
      return path;
    }
    return spell(net, tokens);
  }

  /** A path whose non-empty arcs spell {@code tokens} (dynamic programme over slot × tokens used), or null. */
  private static int[] spell(ConfusionNetwork net, List<String> tokens) {
    int slots = net.slotCount();
    int m = tokens.size();
    // reach[s][p]: arc taken in slot s-1 to reach (s, p) from a reachable (s-1, p'), or -2 when unreachable
    int[][] via = new int[slots + 1][m + 1];
    for (int[] row : via) Arrays.fill(row, -2);
    via[0][0] = -1;
    for (int s = 0; s < slots; s++) {
      for (int p = 0; p <= m; p++) {
        if (via[s][p] == -2) continue;
        for (int a = net.arcStart(s); a < net.arcEnd(s); a++) {
          String t = net.arcText(a);
          int q = t == null ? p : (p < m && t.equals(tokens.get(p)) ? p + 1 : -1);
          if (q >= 0 && via[s + 1][q] == -2) via[s + 1][q] = a;
        }
      }
    }
    if (via[slots][m] == -2) return null;
    int[] path = new int[slots];
    int p = m;
    for (int s = slots; s > 0; s--) {
      int a = via[s][p];
      path[s - 1] = a;
      if (net.arcText(a) != null) p--;
    }
    return path;
  }
}
