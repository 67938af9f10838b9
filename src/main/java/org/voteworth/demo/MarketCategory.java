package org.voteworth.demo;

import java.util.List;

/**
 * A product category of the fictional marketplace, its file-name slug, its share of reviews,
 * and the things its reviews talk about.
 *
 * @param name the category as written in the {@code category} column
 * @param slug lower case letters, digits and dashes; the file name stem
 * @param weight share of all reviews, before renormalising over the categories in use
 * @param things nouns the review text draws on, singular, plain ASCII or UTF-8
 */
record MarketCategory(String name, String slug, double weight, List<String> things) {
    /** Largest first: the first category in use is the one split into part files. */
    static final List<MarketCategory> ALL = List.of(
            new MarketCategory("Kitchen & Dining", "kitchen-dining", 0.24, List.of(
                    "pan", "kettle", "knife", "chopping board", "mixing bowl", "lid", "handle", "whisk",
                    "teapot", "spatula", "colander", "baking tray", "mug", "grater", "sauce pot", "purée press")),
            new MarketCategory("Books", "books", 0.16, List.of(
                    "story", "plot", "ending", "chapter", "cover", "binding", "print", "translation",
                    "main character", "first half", "index", "map at the front", "paperback", "hardback")),
            new MarketCategory("Home Electronics", "home-electronics", 0.13, List.of(
                    "charger", "cable", "speaker", "remote", "battery", "plug", "screen", "lamp",
                    "adapter", "power button", "fan", "alarm clock", "headset", "display")),
            new MarketCategory("Toys & Games", "toys-games", 0.10, List.of(
                    "puzzle", "board game", "kite", "building set", "doll", "card game", "spinning top",
                    "box", "rule book", "dice", "marble run", "toy train")),
            new MarketCategory("Garden & Outdoors", "garden-outdoors", 0.09, List.of(
                    "hose", "trowel", "planter", "watering can", "bird feeder", "seed tray", "rake",
                    "garden chair", "lantern", "pruner", "sprinkler", "compost bin")),
            new MarketCategory("Sports & Fitness", "sports-fitness", 0.08, List.of(
                    "yoga mat", "water bottle", "skipping rope", "dumbbell", "backpack", "cycling glove",
                    "tent", "strap", "grip", "ball", "headband", "foam roller")),
            new MarketCategory("Beauty & Personal Care", "beauty-personal-care", 0.07, List.of(
                    "hair brush", "soap", "hand cream", "comb", "mirror", "towel", "nail file", "scent",
                    "pump", "bottle", "shaving brush", "face cloth")),
            new MarketCategory("Pet Supplies", "pet-supplies", 0.06, List.of(
                    "dog bed", "lead", "collar", "cat tree", "feeding bowl", "chew toy", "litter tray",
                    "brush", "carrier", "scratching post", "treat jar")),
            new MarketCategory("Tools & Home Improvement", "tools-home-improvement", 0.04, List.of(
                    "drill", "screwdriver", "tape measure", "spirit level", "hammer", "paint roller",
                    "tool box", "clamp", "saw", "wall hook", "ladder")),
            new MarketCategory("Baby & Nursery", "baby-nursery", 0.03, List.of(
                    "pram blanket", "bottle warmer", "cot sheet", "bib", "rattle", "night light",
                    "changing mat", "sleep suit", "high chair", "play mat")));

    /** The first {@code n} categories, largest first. */
    static List<MarketCategory> first(int n) {
        return ALL.subList(0, n);
    }
}
