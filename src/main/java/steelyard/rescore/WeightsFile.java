package steelyard.rescore;

import com.fasterxml.jackson.core.JsonFactory;
import com.fasterxml.jackson.core.JsonGenerator;
import com.fasterxml.jackson.core.JsonLocation;
import com.fasterxml.jackson.core.JsonParser;
import com.fasterxml.jackson.core.JsonProcessingException;
import com.fasterxml.jackson.core.JsonToken;
import java.io.IOException;
import java.io.Reader;
import java.io.StringWriter;
import java.io.UncheckedIOException;
import java.io.Writer;
import java.nio.file.Path;
import java.util.Collection;
import java.util.Locale;
import java.util.Map;
import steelyard.io.AtomicOutput;
import steelyard.io.InputException;
import steelyard.io.InputFiles;
import steelyard.io.JsonOutput;
import steelyard.text.Unit;

/**
 * Reads and writes the weights file (JSON, schema {@value #FORMAT} version {@value #VERSION}, documented in
 * the README). Every problem is an {@link InputException} naming {@code file:line:column} from the JSON
 * parser's location: text that is not JSON, an unknown key or weight name, a value of the wrong type.
 * Versions 1 and 2 are still read: version 1 differs only in naming the posterior sharpness
 * {@value #POSTERIOR_SHARPNESS_V1}; version 3 adds the optional {@code method} and {@code tuning} keys (the
 * method the weights were tuned for and a {@link TuningRecord}). A file is written as the lowest version that
 * holds its content: {@value #PLAIN_VERSION} unless it records a method or tuning, so weights saved without
 * tuning stay readable by programs that know version 2 only.
 *
 * <pre>{@code
 * {"format": "steelyard-weights", "version": 2, "unit": "word", "log_base": "e",
 *  "model": {"file": "dock.arpa", "order": 3, "bytes": 81234, "sha256": "…"},
 *  "methods": {"nbest": {"features": {"acoustic": 1.0}, "lm_weight": 9.5, "oov_weight": 0.0,
 *                        "length_weight": -0.5, "posterior_sharpness": 0.1, "system_weights": {}},
 *              "mbr": {"max_hypotheses": 100},
 *              "lattice": {"lm_weight": 0.3, "length_weight": 0.0, "beam": 64, "max_hypotheses": 200,
 *                          "vote_confidence": null}}}
 * }</pre>
 */
public final class WeightsFile {
  public static final String FORMAT = "steelyard-weights";
  /** The newest version, read and written. */
  public static final int VERSION = 3;
  /** The version written when a file records no method and no tuning. */
  public static final int PLAIN_VERSION = 2;
  /** The oldest version still read. */
  public static final int OLDEST_VERSION = 1;
  /** Key of the posterior sharpness α in {@code methods.nbest}. */
  public static final String POSTERIOR_SHARPNESS = "posterior_sharpness";
  /** The same key as version 1 spelt it. */
  public static final String POSTERIOR_SHARPNESS_V1 = "posterior_scale";

  private static final JsonFactory JSON = JsonFactory.builder()
      .disable(JsonFactory.Feature.INTERN_FIELD_NAMES)
      .build()
      .enable(JsonParser.Feature.STRICT_DUPLICATE_DETECTION)
      .disable(JsonGenerator.Feature.AUTO_CLOSE_TARGET);

  private WeightsFile() {}

  /**
   * Reads a weights file. {@code knownFeatures} are the feature columns of this run; a feature weight
   * naming another column is an error. When it is empty, any feature name is accepted (the run takes its
   * features from the file).
   */
  public static WeightsSpec read(Path file, Collection<String> knownFeatures) {
    // Read like every other input: strict UTF-8 with its line and column, a leading BOM dropped, .gz, '-'.
    try (Reader in = InputFiles.open(file)) {
      return read(file, in, knownFeatures);
    } catch (IOException e) {
      throw InputException.inFile(file, "cannot read (" + e.getMessage() + ")", "a readable weights file").withCause(e);
    }
  }

  /**
   * Reads weights from {@code in}; {@code file} names it in messages. A key given twice in one object and a
   * string holding a lone UTF-16 surrogate (from a <code>&#92;uD800</code> escape) are refused; messages about
   * malformed JSON are in the project's words, without the parser's internals.
   */
  public static WeightsSpec read(Path file, Reader in, Collection<String> knownFeatures) throws IOException {
    try (JsonParser p = JSON.createParser(in)) {
      return new WeightsParser(file, p, knownFeatures).document();
    } catch (JsonProcessingException e) {
      throw at(file, e.getLocation(), JsonProblems.describe(e), JsonProblems.expected(e)).withCause(e);
    }
  }

  /** Writes {@code spec} atomically to {@code target} ({@code -} for the process's stdout). */
  public static void save(Path target, WeightsSpec spec) {
    AtomicOutput.writeText(target, out -> write(out, spec));
  }

  /** Writes {@code spec} atomically to {@code target}; {@code -} writes to {@code stdout}. */
  public static void save(Path target, WeightsSpec spec, java.io.Writer stdout) {
    AtomicOutput.writeText(target, stdout, out -> write(out, spec));
  }

  /** The JSON text of {@code spec}: fixed key order, LF line ends, so equal weights give equal bytes. */
  public static String toJson(WeightsSpec spec) {
    StringWriter sw = new StringWriter();
    try {
      write(sw, spec);
    } catch (IOException e) {
      throw new UncheckedIOException(e);
    }
    return sw.toString();
  }

  /** Writes the JSON text of {@code spec}; values it does not give are left out (readers then use the defaults). */
  public static void write(Writer out, WeightsSpec s) throws IOException {
    try (JsonGenerator g = JSON.createGenerator(out)) {
      g.setPrettyPrinter(JsonOutput.prettyPrinter());
      g.writeStartObject();
      g.writeStringField("format", FORMAT);
      g.writeNumberField("version", s.method != null || s.tuning != null ? VERSION : PLAIN_VERSION);
      if (s.unit != null) g.writeStringField("unit", s.unit.name().toLowerCase(Locale.ROOT));
      g.writeStringField("log_base", "e");
      if (s.method != null) g.writeStringField("method", s.method.label());
      g.writeFieldName("model");
      if (s.model == null) {
        g.writeNull();
      } else {
        g.writeStartObject();
        g.writeStringField("file", s.model.file());
        g.writeNumberField("order", s.model.order());
        g.writeNumberField("bytes", s.model.bytes());
        g.writeStringField("sha256", s.model.sha256());
        g.writeEndObject();
      }
      g.writeObjectFieldStart("methods");
      g.writeObjectFieldStart("nbest");
      writeMap(g, "features", s.features);
      number(g, "lm_weight", s.lmWeight);
      number(g, "oov_weight", s.oovWeight);
      number(g, "length_weight", s.lengthWeight);
      number(g, POSTERIOR_SHARPNESS, s.posteriorScale);
      writeMap(g, "system_weights", s.systemWeights);
      g.writeEndObject();
      g.writeObjectFieldStart("mbr");
      integer(g, "max_hypotheses", s.mbrMaxHypotheses);
      g.writeEndObject();
      g.writeObjectFieldStart("lattice");
      number(g, "lm_weight", s.latticeLmWeight);
      number(g, "length_weight", s.latticeLengthWeight);
      integer(g, "beam", s.beam);
      integer(g, "max_hypotheses", s.latticeMaxHypotheses);
      if (s.voteConfidence == null) g.writeNullField("vote_confidence");
      else g.writeStringField("vote_confidence", s.voteConfidence);
      g.writeEndObject();
      g.writeEndObject();
      if (s.tuning != null) TuningJson.write(g, s.tuning);
      g.writeEndObject();
    }
    out.write('\n');
  }

  private static void writeMap(JsonGenerator g, String name, Map<String, Double> m) throws IOException {
    g.writeObjectFieldStart(name);
    for (Map.Entry<String, Double> e : m.entrySet()) g.writeNumberField(e.getKey(), e.getValue());
    g.writeEndObject();
  }

  private static void number(JsonGenerator g, String name, Double v) throws IOException {
    if (v != null) g.writeNumberField(name, v);
  }

  private static void integer(JsonGenerator g, String name, Integer v) throws IOException {
    if (v != null) g.writeNumberField(name, v);
  }

  static InputException at(Path file, JsonLocation loc, String problem, String expected) {
    if (loc == null || loc.getLineNr() < 1) return InputException.inFile(file, problem, expected);
    return InputException.at(file, loc.getLineNr(), Math.max(0, loc.getColumnNr()), problem, expected);
  }

  /** The method of a label ({@code nbest}, {@code mbr}, {@code consensus}, {@code lattice}); null when unknown. */
  static RescoreMethod parseMethod(String s) {
    for (RescoreMethod m : RescoreMethod.values()) if (m.label().equals(s)) return m;
    return null;
  }

  /** Unit names accepted in the file. */
  static Unit parseUnit(String s) {
    switch (s) {
      case "word": return Unit.WORD;
      case "char": return Unit.CHAR;
      default: return null;
    }
  }
}
