package steelyard.rescore;

import com.fasterxml.jackson.core.JsonLocation;
import com.fasterxml.jackson.core.JsonParser;
import com.fasterxml.jackson.core.JsonToken;
import java.io.IOException;
import java.nio.file.Path;
import java.util.ArrayList;
import java.util.Collection;
import java.util.Locale;
import java.util.List;
import java.util.Map;
import java.util.Set;
import java.util.TreeSet;
import steelyard.io.InputException;
import steelyard.io.Messages;

/**
 * Streaming reader of the weights-file schema (see {@link WeightsFile}); streaming rather than a tree so that
 * every error can name the line and column of the offending token.
 */
final class WeightsParser {
  private final Path file;
  private final JsonParser p;
  private final Set<String> knownFeatures;
  private final WeightsSpec spec = new WeightsSpec();
  /** The version read, 0 before "version"; the posterior-sharpness key's spelling is checked against it at the end. */
  private int version;
  private String sharpnessKey;
  private JsonLocation sharpnessAt;
  /** The first version-3 key met ({@code method} or {@code tuning}) and where; checked against the version at the end. */
  private String newerKey;
  private JsonLocation newerAt;

  WeightsParser(Path file, JsonParser p, Collection<String> knownFeatures) {
    this.file = file;
    this.p = p;
    this.knownFeatures = new TreeSet<>(knownFeatures);
  }

  WeightsSpec document() throws IOException {
    JsonToken t = p.nextToken();
    if (t == null) throw InputException.inFile(file, "empty weights file", "a JSON object with \"format\": \"" + WeightsFile.FORMAT + "\"");
    expect(JsonToken.START_OBJECT, "a JSON object");
    boolean sawFormat = false;
    boolean sawVersion = false;
    while (nextField()) {
      String key = p.currentName();
      p.nextToken();
      switch (key) {
        case "format":
          String f = string();
          if (!WeightsFile.FORMAT.equals(f)) throw fail("format is '" + f + "'", "\"" + WeightsFile.FORMAT + "\"");
          sawFormat = true;
          break;
        case "version":
          int v = integer(0);
          if (v < WeightsFile.OLDEST_VERSION || v > WeightsFile.VERSION)
            throw fail("unsupported version " + v, "version " + WeightsFile.VERSION + " (versions " + WeightsFile.OLDEST_VERSION + " and "
                + WeightsFile.PLAIN_VERSION + " are still read)");
          version = v;
          sawVersion = true;
          break;
        case "unit":
          String u = string();
          spec.unit = WeightsFile.parseUnit(u);
          if (spec.unit == null) throw fail("unknown unit '" + u + "'", "\"word\" or \"char\"");
          break;
        case "log_base":
          String b = string();
          if (!"e".equals(b)) throw fail("log base '" + b + "'", "\"e\" (weights multiply natural-log scores)");
          break;
        case "model":
          model();
          break;
        case "methods":
          methods();
          break;
        case "method":
          sawNewer(key);
          String m = string();
          spec.method = WeightsFile.parseMethod(m);
          if (spec.method == null) throw fail("unknown method '" + m + "'", "\"nbest\", \"mbr\", \"consensus\" or \"lattice\"");
          break;
        case TuningJson.KEY:
          sawNewer(key);
          spec.tuning = tuning();
          break;
        default:
          throw unknownKey(key, "format, version, unit, log_base, method, model, methods, tuning");
      }
    }
    if (p.nextToken() != null) throw fail("text after the closing brace", "one JSON object");
    if (!sawFormat || !sawVersion)
      throw InputException.inFile(file, "missing \"" + (sawFormat ? "version" : "format") + "\"", "\"format\": \"" + WeightsFile.FORMAT + "\", \"version\": " + WeightsFile.VERSION);
    checkSharpnessSpelling();
    checkNewerKeys();
    return spec;
  }

  private void sawNewer(String key) {
    if (newerKey != null) return;
    newerKey = key;
    newerAt = p.currentTokenLocation();
  }

  /** {@code method} and {@code tuning} came with version 3. */
  private void checkNewerKeys() {
    if (newerKey == null || version >= 3) return;
    throw WeightsFile.at(file, newerAt, "'" + newerKey + "' in a version " + version + " file",
        "\"version\": " + WeightsFile.VERSION + " (the version that added it)");
  }

  /** The {@code dev} object of {@code tuning}; every part is required. */
  private record Dev(TuningRecord.DataFile hypotheses, TuningRecord.DataFile references, Integer utterances, Long tokens) {
    boolean complete() {
      return hypotheses != null && references != null && utterances != null && tokens != null;
    }
  }

  private TuningRecord tuning() throws IOException {
    expect(JsonToken.START_OBJECT, "an object");
    Dev dev = null;
    List<String> changed = List.of();
    double devRate = Double.NaN;
    double cvRate = Double.NaN;
    int folds = 0;
    long seed = 0;
    while (nextField()) {
      String key = p.currentName();
      p.nextToken();
      switch (key) {
        case "dev": dev = dev(); break;
        case "changed": changed = names(); break;
        case "dev_error_rate": devRate = rateOrNull(); break;
        case "cv_error_rate": cvRate = rateOrNull(); break;
        case "folds": folds = integer(0); break;
        case "seed": seed = longValue(); break;
        default: throw unknownKey(key, "dev, changed, dev_error_rate, cv_error_rate, folds, seed");
      }
    }
    if (dev == null) throw fail("tuning needs its dev data", "\"dev\": {\"hypotheses\": …, \"references\": …, \"utterances\": N, \"reference_tokens\": N}");
    return new TuningRecord(dev.hypotheses(), dev.references(), dev.utterances(), dev.tokens(), changed, devRate, cvRate, folds, seed);
  }

  private Dev dev() throws IOException {
    expect(JsonToken.START_OBJECT, "an object");
    Dev d = new Dev(null, null, null, null);
    while (nextField()) {
      String key = p.currentName();
      p.nextToken();
      switch (key) {
        case "hypotheses": d = new Dev(dataFile(), d.references(), d.utterances(), d.tokens()); break;
        case "references": d = new Dev(d.hypotheses(), dataFile(), d.utterances(), d.tokens()); break;
        case "utterances": d = new Dev(d.hypotheses(), d.references(), integer(0), d.tokens()); break;
        case "reference_tokens": d = new Dev(d.hypotheses(), d.references(), d.utterances(), longValue()); break;
        default: throw unknownKey(key, "hypotheses, references, utterances, reference_tokens");
      }
    }
    if (!d.complete()) throw fail("dev needs hypotheses, references, utterances and reference_tokens", "all four keys");
    return d;
  }

  private TuningRecord.DataFile dataFile() throws IOException {
    expect(JsonToken.START_OBJECT, "an object");
    FileFields f = fileFields(false);
    if (f.name() == null || f.bytes() == null || f.sha256() == null)
      throw fail("a data file needs file, bytes and sha256", "{\"file\": …, \"bytes\": N, \"sha256\": \"…\"}");
    return new TuningRecord.DataFile(f.name(), f.bytes(), f.sha256());
  }

  /** The keys that identify a file by content (a model also has its order); null where absent. */
  private record FileFields(String name, Integer order, Long bytes, String sha256) {}

  /** Reads the fields of the current object: {@code file}, {@code bytes}, {@code sha256} and, when allowed, {@code order}. */
  private FileFields fileFields(boolean withOrder) throws IOException {
    String name = null;
    Integer order = null;
    Long bytes = null;
    String sha = null;
    while (nextField()) {
      String key = p.currentName();
      p.nextToken();
      switch (key) {
        case "file": name = string(); break;
        case "order":
          if (!withOrder) throw unknownKey(key, "file, bytes, sha256");
          order = integer(1);
          break;
        case "bytes": bytes = longValue(); break;
        case "sha256": sha = string(); break;
        default: throw unknownKey(key, withOrder ? "file, order, bytes, sha256" : "file, bytes, sha256");
      }
    }
    return new FileFields(name, order, bytes, sha);
  }

  private List<String> names() throws IOException {
    expect(JsonToken.START_ARRAY, "an array of weight names");
    List<String> out = new ArrayList<>();
    while (p.nextToken() != JsonToken.END_ARRAY) out.add(string());
    return out;
  }

  private double rateOrNull() throws IOException {
    return p.currentToken() == JsonToken.VALUE_NULL ? Double.NaN : number();
  }

  private void model() throws IOException {
    if (p.currentToken() == JsonToken.VALUE_NULL) return;
    expect(JsonToken.START_OBJECT, "an object or null");
    FileFields f = fileFields(true);
    if (f.order() == null || f.bytes() == null || f.sha256() == null)
      throw fail("model needs order, bytes and sha256", "\"model\": {\"file\": …, \"order\": N, \"bytes\": N, \"sha256\": \"…\"}");
    spec.model = new ModelIdentity(f.name() == null ? "" : f.name(), f.order(), f.bytes(), f.sha256());
  }

  private void methods() throws IOException {
    expect(JsonToken.START_OBJECT, "an object of methods");
    while (nextField()) {
      String key = p.currentName();
      p.nextToken();
      expect(JsonToken.START_OBJECT, "an object");
      switch (key) {
        case "nbest": nbest(); break;
        case "mbr": mbr(); break;
        case "lattice": lattice(); break;
        default: throw unknownKey(key, "nbest, mbr, lattice");
      }
    }
  }

  private void nbest() throws IOException {
    while (nextField()) {
      String key = p.currentName();
      p.nextToken();
      switch (key) {
        case "features": features(); break;
        case "lm_weight": spec.lmWeight = number(); break;
        case "oov_weight": spec.oovWeight = number(); break;
        case "length_weight": spec.lengthWeight = number(); break;
        case WeightsFile.POSTERIOR_SHARPNESS, WeightsFile.POSTERIOR_SHARPNESS_V1:
          spec.posteriorScale = positive();
          sharpnessKey = key;
          sharpnessAt = p.currentTokenLocation();
          break;
        case "system_weights": systems(); break;
        default: throw unknownKey(key, "features, lm_weight, oov_weight, length_weight, " + WeightsFile.POSTERIOR_SHARPNESS + ", system_weights");
      }
    }
  }

  /** Version 1 spells the posterior sharpness {@code posterior_scale}, later versions {@code posterior_sharpness}. */
  private void checkSharpnessSpelling() {
    if (sharpnessKey == null) return;
    String expected = version == 1 ? WeightsFile.POSTERIOR_SHARPNESS_V1 : WeightsFile.POSTERIOR_SHARPNESS;
    if (sharpnessKey.equals(expected)) return;
    throw WeightsFile.at(file, sharpnessAt, "'" + sharpnessKey + "' in a version " + version + " file", version == 1
        ? "\"" + expected + "\" in version 1, or \"version\": " + WeightsFile.PLAIN_VERSION + " with \"" + WeightsFile.POSTERIOR_SHARPNESS + "\""
        : "\"" + expected + "\" (\"" + sharpnessKey + "\" is the version 1 spelling)");
  }

  private void mbr() throws IOException {
    while (nextField()) {
      String key = p.currentName();
      p.nextToken();
      if (!"max_hypotheses".equals(key)) throw unknownKey(key, "max_hypotheses");
      spec.mbrMaxHypotheses = integer(1);
    }
  }

  private void lattice() throws IOException {
    while (nextField()) {
      String key = p.currentName();
      p.nextToken();
      switch (key) {
        case "lm_weight": spec.latticeLmWeight = number(); break;
        case "length_weight": spec.latticeLengthWeight = number(); break;
        case "beam": spec.beam = integer(1); break;
        case "max_hypotheses": spec.latticeMaxHypotheses = integer(1); break;
        case "vote_confidence": spec.voteConfidence = voteConfidence(); break;
        default: throw unknownKey(key, "lm_weight, length_weight, beam, max_hypotheses, vote_confidence");
      }
    }
  }

  /** A feature column name or null; a name outside the run's --features is an error. */
  private String voteConfidence() throws IOException {
    if (p.currentToken() == JsonToken.VALUE_NULL) return null;
    String name = string();
    if (!knownFeatures.isEmpty() && !knownFeatures.contains(name))
      throw fail("unknown vote confidence '" + name + "'", "one of the --features columns: " + String.join(", ", knownFeatures));
    return name;
  }

  private void features() throws IOException {
    expect(JsonToken.START_OBJECT, "an object of feature weights");
    while (nextField()) {
      String name = p.currentName();
      if (!knownFeatures.isEmpty() && !knownFeatures.contains(name))
        throw fail("unknown weight name '" + name + "'", "a weight for one of the --features columns: " + String.join(", ", knownFeatures));
      p.nextToken();
      spec.features.put(name, number());
    }
  }

  private void systems() throws IOException {
    expect(JsonToken.START_OBJECT, "an object of system weights");
    Map<String, Double> m = spec.systemWeights;
    while (nextField()) {
      String name = p.currentName();
      p.nextToken();
      m.put(name, positive());
    }
  }

  /** Advances to the next field name of the current object; false at its end. */
  private boolean nextField() throws IOException {
    JsonToken t = p.nextToken();
    if (t == JsonToken.END_OBJECT) return false;
    if (t != JsonToken.FIELD_NAME) throw fail("unexpected " + t, "a field name");
    validUnicode(p.currentName(), "key");
    return true;
  }

  /** A lone surrogate (a <code>&#92;uD800</code> escape) is no character: no file, report or message could hold it. */
  private void validUnicode(String s, String what) {
    int i = Messages.loneSurrogate(s);
    if (i >= 0) {
      throw fail(what + " '" + Messages.shown(s, 40) + "' contains a lone UTF-16 surrogate (\\u"
          + String.format(Locale.ROOT, "%04X", (int) s.charAt(i)) + ") that is not a character", "text of valid Unicode characters");
    }
  }

  private void expect(JsonToken type, String what) {
    if (p.currentToken() != type) throw fail("found " + describe(), what);
  }

  private String string() throws IOException {
    if (p.currentToken() != JsonToken.VALUE_STRING) throw fail("'" + p.currentName() + "' is " + describe(), "a string");
    validUnicode(p.getText(), "value");
    return p.getText();
  }

  private double number() throws IOException {
    JsonToken t = p.currentToken();
    if (t != JsonToken.VALUE_NUMBER_INT && t != JsonToken.VALUE_NUMBER_FLOAT)
      throw fail("'" + p.currentName() + "' is " + describe(), "a number");
    double v = p.getDoubleValue();
    if (!Double.isFinite(v)) throw fail("'" + p.currentName() + "' is not finite", "a finite number");
    return v;
  }

  private double positive() throws IOException {
    double v = number();
    if (!(v > 0)) throw fail("'" + p.currentName() + "' is " + v, "a number > 0");
    return v;
  }

  private int integer(int min) throws IOException {
    long v = longValue();
    if (v < min || v > Integer.MAX_VALUE) throw fail("'" + p.currentName() + "' is " + v, "an integer >= " + min);
    return (int) v;
  }

  private long longValue() throws IOException {
    if (p.currentToken() != JsonToken.VALUE_NUMBER_INT) throw fail("'" + p.currentName() + "' is " + describe(), "an integer");
    return p.getLongValue();
  }

  private String describe() {
    JsonToken t = p.currentToken();
    if (t == null) return "the end of the file";
    switch (t) {
      case VALUE_STRING: return "a string";
      case VALUE_NUMBER_INT: case VALUE_NUMBER_FLOAT: return "a number";
      case VALUE_TRUE: case VALUE_FALSE: return "a boolean";
      case VALUE_NULL: return "null";
      case START_OBJECT: return "an object";
      case START_ARRAY: return "an array";
      default: return t.asString() == null ? t.name() : "'" + t.asString() + "'";
    }
  }

  private InputException unknownKey(String key, String allowed) {
    return fail("unknown key '" + key + "'", "one of " + allowed);
  }

  private InputException fail(String problem, String expected) {
    return WeightsFile.at(file, p.currentTokenLocation(), problem, expected);
  }
}
