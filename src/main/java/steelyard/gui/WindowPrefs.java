package steelyard.gui;

import java.nio.file.Path;
import java.util.ArrayList;
import java.util.List;
import java.util.prefs.BackingStoreException;
import java.util.prefs.Preferences;
import steelyard.gui.model.OpenRequest;
import steelyard.io.FeatureSpec;
import steelyard.rescore.RescoreMethod;
import steelyard.text.NormalisationOptions;
import steelyard.text.Unit;

/**
 * What the window remembers between runs, in a {@link Preferences} node: the most recently opened file sets
 * and the layout (bounds, divider positions, selected view). The default node is the user's
 * {@code steelyard/window}; tests pass a node of their own and remove it afterwards.
 */
public final class WindowPrefs {
  /** How many file sets the File ▸ Recent menu keeps. */
  public static final int MAX_RECENT = 8;
  private static final String SEP = "\u001f";

  private final Preferences node;

  public WindowPrefs(Preferences node) {
    this.node = node;
  }

  /** The user's own node. */
  public static WindowPrefs user() {
    return new WindowPrefs(Preferences.userRoot().node("steelyard/window"));
  }

  public Preferences node() {
    return node;
  }

  /** Recent file sets, newest first. */
  public List<OpenRequest> recent() {
    List<OpenRequest> out = new ArrayList<>();
    for (int k = 0; k < MAX_RECENT; k++) {
      String v = node.get("recent." + k, null);
      if (v == null) break;
      OpenRequest r = decode(v);
      if (r != null) out.add(r);
    }
    return out;
  }

  /** Puts {@code r} first in the recent list (dropping an equal older entry and the oldest beyond the limit). */
  public void addRecent(OpenRequest r) {
    String code = encode(r);
    List<String> list = new ArrayList<>();
    list.add(code);
    for (OpenRequest o : recent()) {
      String c = encode(o);
      if (!c.equals(code) && list.size() < MAX_RECENT) list.add(c);
    }
    for (int k = 0; k < MAX_RECENT; k++) {
      if (k < list.size()) node.put("recent." + k, list.get(k)); else node.remove("recent." + k);
    }
    flush();
  }

  /** Window bounds in screen pixels (a plain record, so that reading preferences never starts AWT). */
  public record Bounds(int x, int y, int width, int height) {}

  /** The saved window bounds, or null. */
  public Bounds bounds() {
    int w = node.getInt("bounds.w", -1);
    if (w <= 0) return null;
    return new Bounds(node.getInt("bounds.x", 0), node.getInt("bounds.y", 0), w, node.getInt("bounds.h", 700));
  }

  public void bounds(Bounds r) {
    node.putInt("bounds.x", r.x());
    node.putInt("bounds.y", r.y());
    node.putInt("bounds.w", r.width());
    node.putInt("bounds.h", r.height());
  }

  /** A saved integer of the layout (divider positions, selected tab), or {@code fallback}. */
  public int layout(String key, int fallback) {
    return node.getInt("layout." + key, fallback);
  }

  public void putLayout(String key, int value) {
    node.putInt("layout." + key, value);
  }

  /** Writes pending changes to the backing store; a failure only loses the preferences. */
  public void flush() {
    try {
      node.flush();
    } catch (BackingStoreException e) {
      // preferences are a convenience: the window works without them
    }
  }

  static String encode(OpenRequest r) {
    NormalisationOptions n = r.normalisation();
    List<String> f = new ArrayList<>();
    for (FeatureSpec s : r.features()) f.add(s.toString());
    return String.join(SEP, s(r.hyps()), s(r.refs()), s(r.lm()), s(r.weights()), String.join(",", f),
        r.unit() == null ? "" : r.unit().name(), s(n.rulesFile()), flags(n), r.methodOrDefault().name());
  }

  static OpenRequest decode(String v) {
    String[] p = v.split(SEP, -1);
    if (p.length != 9 || p[0].isEmpty()) return null;
    try {
      NormalisationOptions n = new NormalisationOptions(p[7].charAt(0) == '1', p[7].charAt(1) == '1', p[7].charAt(2) == '1',
          p[7].charAt(3) == '1', path(p[6]));
      return OpenRequest.of(path(p[0]), path(p[1]), path(p[2]), path(p[3]), FeatureSpec.parseList(p[4]),
          p[5].isEmpty() ? null : Unit.valueOf(p[5]), n, RescoreMethod.valueOf(p[8]));
    } catch (RuntimeException e) {
      return null;
    }
  }

  private static String flags(NormalisationOptions n) {
    return (n.foldCase() ? "1" : "0") + (n.stripPunctuation() ? "1" : "0") + (n.splitHyphens() ? "1" : "0")
        + (n.ignoreWhitespace() ? "1" : "0");
  }

  private static String s(Path p) {
    return p == null ? "" : p.toAbsolutePath().toString();
  }

  private static Path path(String s) {
    return s.isEmpty() ? null : Path.of(s);
  }
}
