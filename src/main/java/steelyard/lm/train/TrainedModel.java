package steelyard.lm.train;

import java.util.Objects;
import steelyard.lm.BackoffModel;
import steelyard.lm.LanguageModel;

/**
 * The result of training.
 *
 * @param model   the model for querying (a {@link BackoffModel}, or an in-memory add-k model)
 * @param report  statistics of the run
 */
public record TrainedModel(LanguageModel model, TrainingReport report) {
  public TrainedModel {
    Objects.requireNonNull(model, "model");
    Objects.requireNonNull(report, "report");
  }

  /** Whether the model is an exact back-off model that can be saved. */
  public boolean hasBackoffForm() {
    return model instanceof BackoffModel;
  }

  /** The model as a back-off model; {@link IllegalStateException} for add-k. */
  public BackoffModel backoffModel() {
    if (model instanceof BackoffModel b) return b;
    throw new IllegalStateException(report.smoothing().key() + " smoothing has no exact back-off form");
  }
}
