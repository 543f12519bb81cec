package steelyard.lattice;

import java.io.IOException;
import java.io.Writer;
import java.util.Locale;
import steelyard.io.CsvWriter;

/**
 * Writes one utterance's {@link ConfusionNetwork} for inspection. Callers route the writer through
 * {@code steelyard.io.AtomicOutput}. Output depends only on the network, so equal inputs give identical bytes.
 *
 * <p><b>Graphviz DOT</b>: nodes {@code b0 … bN} are slot boundaries, each arc an edge {@code b(s) -> b(s+1)}
 * labelled with its token and posterior; the consensus arc of each slot is drawn thick, empty arcs dashed
 * and labelled {@value #EMPTY_LABEL}. Token text is escaped so that no input can end a string or inject
 * syntax: backslash and quote get a backslash, {@code & < >} become entities, and every control, format
 * (e.g. right-to-left marks), separator or lone-surrogate character is shown as {@code <U+XXXX>}.
 *
 * <p><b>Arc CSV</b> ({@link CsvWriter#plain}: RFC 4180, fields quoted only when needed, LF line ends), one row
 * per arc in slot order, columns: {@code slot} (0-based), {@code arc} (0-based within the slot),
 * {@code token} (the raw token text, exactly; empty for the empty arc), {@code empty} (1 for the empty arc,
 * else 0), {@code posterior} (10 decimals), {@code hypothesis_count}, {@code hypotheses} (input indices,
 * ascending, space-separated) and {@code consensus} (1 on the arc consensus decoding takes). Tokens are
 * not altered, so a token such as {@code =SUM(} stays as it is: spreadsheet users should import the file
 * as text.
 */
public final class NetworkExport {
  /** Label of empty arcs in DOT output. */
  public static final String EMPTY_LABEL = "(empty)";

  static final String[] CSV_HEADER = {
    "slot", "arc", "token", "empty", "posterior", "hypothesis_count", "hypotheses", "consensus"
  };

  private NetworkExport() {}

  /** Graphviz DOT of {@code net}; {@code title} (may be null) becomes the graph label, escaped like tokens. */
  public static void writeDot(ConfusionNetwork net, String title, Writer out) throws IOException {
    out.write("digraph confusion_network {\n");
    out.write("  graph [rankdir=LR");
    if (title != null) out.write(", label=\"" + dotText(title) + "\", labelloc=t");
    out.write("];\n");
    out.write("  node [shape=circle, width=0.25, label=\"\"];\n");
    for (int s = 0; s <= net.slotCount(); s++) out.write("  b" + s + ";\n");
    for (int s = 0; s < net.slotCount(); s++) {
      int best = net.consensusArc(s);
      for (int a = net.arcStart(s); a < net.arcEnd(s); a++) {
        String label = net.isEmpty(a) ? EMPTY_LABEL : dotText(net.arcText(a));
        out.write("  b" + s + " -> b" + (s + 1) + " [label=\"" + label + "\\n"
            + String.format(Locale.ROOT, "%.4f", net.arcPosterior(a)) + "\"");
        if (net.isEmpty(a)) out.write(", style=dashed");
        if (a == best) out.write(", penwidth=3");
        out.write("];\n");
      }
    }
    out.write("}\n");
    out.flush();
  }

  /** The arc CSV of {@code net} (format in the class comment). */
  public static void writeCsv(ConfusionNetwork net, Writer out) throws IOException {
    CsvWriter csv = CsvWriter.plain(out);
    csv.row(CSV_HEADER);
    for (int s = 0; s < net.slotCount(); s++) {
      int best = net.consensusArc(s);
      for (int a = net.arcStart(s); a < net.arcEnd(s); a++) {
        StringBuilder hyps = new StringBuilder();
        for (int h : net.arcHypotheses(a)) {
          if (hyps.length() > 0) hyps.append(' ');
          hyps.append(h);
        }
        csv.row(
          Integer.toString(s),
          Integer.toString(a - net.arcStart(s)),
          net.isEmpty(a) ? "" : net.arcText(a),
          net.isEmpty(a) ? "1" : "0",
          String.format(Locale.ROOT, "%.10f", net.arcPosterior(a)),
          Integer.toString(net.arcHypothesisCount(a)),
          hyps.toString(),
          a == best ? "1" : "0");
      }
    }
    csv.flush();
  }

  /** Text safe inside a DOT double-quoted string (rules in the class comment). */
  static String dotText(String raw) {
    StringBuilder b = new StringBuilder(raw.length() + 8);
    for (int i = 0; i < raw.length(); ) {
      int cp = raw.codePointAt(i);
      i += Character.charCount(cp);
      switch (cp) {
        case '\\' -> b.append("\\\\");
        case '"' -> b.append("\\\"");
        case '&' -> b.append("&amp;");
        case '<' -> b.append("&lt;");
        case '>' -> b.append("&gt;");
        default -> {
          if (visible(cp)) b.appendCodePoint(cp);
          else b.append("&lt;U+").append(String.format(Locale.ROOT, "%04X", cp)).append("&gt;");
        }
      }
    }
    return b.toString();
  }

  private static boolean visible(int cp) {
    switch (Character.getType(cp)) {
      case Character.CONTROL, Character.FORMAT, Character.LINE_SEPARATOR, Character.PARAGRAPH_SEPARATOR,
          Character.SURROGATE, Character.UNASSIGNED, Character.PRIVATE_USE -> {
        return false;
      }
      default -> {
        return true;
      }
    }
  }
}
