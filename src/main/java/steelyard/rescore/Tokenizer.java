package steelyard.rescore;

import steelyard.text.TokenSequence;

/**
 * Turns a hypothesis' raw text into tokens in one unit. The command wires a {@link steelyard.text.Normaliser}
 * with the user's options (for scoring, length and MBR) or with the model's recorded options (for the LM).
 * Implementations must be thread-safe.
 */
@FunctionalInterface
public interface Tokenizer {
  TokenSequence tokenize(String raw);
}
