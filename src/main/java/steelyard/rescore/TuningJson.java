package steelyard.rescore;

import com.fasterxml.jackson.core.JsonGenerator;
import java.io.IOException;
import steelyard.io.JsonOutput;

/**
 * Writes the {@code tuning} object of a version 3 weights file ({@link TuningRecord}); {@link WeightsParser}
 * reads it. Rates have {@value RescoreSummary#RATE_DIGITS} decimals, as in every JSON summary, so a rate read
 * back and written again keeps its bytes.
 */
final class TuningJson {
  static final String KEY = "tuning";

  private TuningJson() {}

  static void write(JsonGenerator g, TuningRecord t) throws IOException {
    g.writeObjectFieldStart(KEY);
    g.writeObjectFieldStart("dev");
    file(g, "hypotheses", t.hypotheses());
    file(g, "references", t.references());
    g.writeNumberField("utterances", t.utterances());
    g.writeNumberField("reference_tokens", t.referenceTokens());
    g.writeEndObject();
    g.writeArrayFieldStart("changed");
    for (String n : t.changed()) g.writeString(n);
    g.writeEndArray();
    rate(g, "dev_error_rate", t.devErrorRate());
    rate(g, "cv_error_rate", t.cvErrorRate());
    g.writeNumberField("folds", t.folds());
    g.writeNumberField("seed", t.seed());
    g.writeEndObject();
  }

  private static void file(JsonGenerator g, String name, TuningRecord.DataFile f) throws IOException {
    g.writeObjectFieldStart(name);
    g.writeStringField("file", f.file());
    g.writeNumberField("bytes", f.bytes());
    g.writeStringField("sha256", f.sha256());
    g.writeEndObject();
  }

  private static void rate(JsonGenerator g, String name, double v) throws IOException {
    if (Double.isFinite(v)) g.writeNumberField(name, JsonOutput.fixed(v, RescoreSummary.RATE_DIGITS));
    else g.writeNullField(name);
  }
}
