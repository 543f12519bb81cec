package steelyard.text;

import java.util.List;

/**
 * A normalised token sequence with a flag per token saying it is optionally deletable (a hesitation or noise
 * marker from the rules file: never an error, whether present or absent).
 *
 * @param tokens   the tokens in order
 * @param optional same length as {@code tokens}; true where the token may be absent without error
 */
public record TokenSequence(List<String> tokens, boolean[] optional) {
  public TokenSequence {
    tokens = List.copyOf(tokens);
    if (optional.length != tokens.size())
      throw new IllegalArgumentException("optional flags " + optional.length + " != tokens " + tokens.size());
  }

  public int size() {
    return tokens.size();
  }
}
