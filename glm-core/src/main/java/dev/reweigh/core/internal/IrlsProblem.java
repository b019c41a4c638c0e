package dev.reweigh.core.internal;

import dev.reweigh.families.Family;
import dev.reweigh.families.Link;

/**
 * The inputs of one IRLS fit, already validated: design, response (as the family sees it),
 * prior weights, total offset, family, link, and which columns may enter (columns held fixed
 * have their contribution in the offset).
 */
public final class IrlsProblem {
    final DesignMatrix x;
    final double[] y;
    final double[] priorWeights;
    final double[] offset;
    final Family family;
    final Link link;
    final boolean[] candidates;

    /**
     * Creates the problem.
     *
     * @param x the design
     * @param y the response
     * @param priorWeights the prior weights
     * @param offset the total offset (never null)
     * @param family the family
     * @param link the link
     * @param candidates true for columns that may enter the fit
     */
    public IrlsProblem(DesignMatrix x, double[] y, double[] priorWeights, double[] offset, Family family, Link link,
            boolean[] candidates) {
        this.x = x;
        this.y = y;
        this.priorWeights = priorWeights;
        this.offset = offset;
        this.family = family;
        this.link = link;
        this.candidates = candidates;
    }
}
