package org.voteworth.tally;

/** How many of a reviewer's reviews gave one to five stars (reviews without a rating are not counted). */
public record StarCounts(long one, long two, long three, long four, long five) {
    public static final StarCounts NONE = new StarCounts(0, 0, 0, 0, 0);

    /** Count for {@code stars} in 1..5. */
    public long of(int stars) {
        return switch (stars) {
            case 1 -> one;
            case 2 -> two;
            case 3 -> three;
            case 4 -> four;
            case 5 -> five;
            default -> throw new IllegalArgumentException("stars must be 1..5, was " + stars);
        };
    }

    public long rated() {
        return one + two + three + four + five;
    }

    public StarCounts plus(StarCounts o) {
        return new StarCounts(one + o.one, two + o.two, three + o.three, four + o.four, five + o.five);
    }
}
