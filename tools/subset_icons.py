"""Writes a Material Symbols font holding only the named icons (their ligatures and the letters
that spell them). Run through `npm run icons:subset`, which passes the font, the names and the output.
Needs fontTools and brotli (Debian: python3-fonttools python3-brotli)."""
import json
import sys

from fontTools import subset
from fontTools.ttLib import TTFont


def ligature_glyphs(font):
    """Maps each ligature's text (e.g. "home") to the glyph it becomes."""
    letters = {glyph: chr(code) for code, glyph in font.getBestCmap().items()}
    found = {}
    for lookup in font["GSUB"].table.LookupList.Lookup:
        for table in lookup.SubTable:
            if table.LookupType == 7:
                table = table.ExtSubTable
            if table.LookupType != 4:
                continue
            for first, ligatures in table.ligatures.items():
                for ligature in ligatures:
                    text = "".join(letters.get(g, "\0") for g in [first] + list(ligature.Component))
                    found.setdefault(text, ligature.LigGlyph)
    return found


def main(source, names_path, output):
    names = json.load(open(names_path))
    font = TTFont(source, recalcTimestamp=False)
    glyphs = ligature_glyphs(font)
    missing = [n for n in names if n not in glyphs]
    if missing:
        sys.exit("not in the font: " + ", ".join(missing))
    options = subset.Options()
    options.flavor = "woff2"
    options.layout_features = ["*"]
    options.layout_closure = False
    options.notdef_outline = True
    subsetter = subset.Subsetter(options)
    subsetter.populate(text="".join(sorted(set("".join(names)))), glyphs=[glyphs[n] for n in names])
    subsetter.subset(font)
    font.flavor = "woff2"
    font.save(output)


if __name__ == "__main__":
    main(*sys.argv[1:4])
