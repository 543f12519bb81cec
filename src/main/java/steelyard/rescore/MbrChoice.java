package steelyard.rescore;

/**
 * The result of an MBR choice.
 *
 * @param chosen         index (into the utterance's kept hypotheses) of the chosen hypothesis
 * @param expectedErrors Σⱼ pⱼ·L(chosen, hⱼ) over the texts that entered the sum, posteriors renormalised over them
 * @param distinctTexts  distinct normalised texts before the cap
 * @param capped         true when the cap left some distinct texts out of the sum
 */
public record MbrChoice(int chosen, double expectedErrors, int distinctTexts, boolean capped) {}
