/* The arc walk of morphfst.runtime.walk in C: every accepting path of one word through a packed arc
 * table (morphfst.compile.arctable), with its side tape, output and weight.
 *
 * The Python walker (ArcWalker) pays for each new (state, letter) pair it meets in dict and tuple work;
 * this module does the same search with plain arrays and gives the same paths (the tests compare the
 * two on every shipped grammar). It runs in three passes over the pairs (position, state) a word
 * reaches, the standard forward-backward trimming of a composition with a string (Mohri 2009,
 * "Weighted automata algorithms"):
 *
 *   1. forward, position by position: the states reached by arcs that read nothing (input label 0 or
 *      one of the "skip" labels, which are written to the side tape) are added to the position's set,
 *      then the arcs that read the position's letter lead to the next position's set; every arc taken
 *      is kept as an edge between two (position, state) pairs; an arc is not taken when its target
 *      cannot go on: when the letters it can read next by arcs that read nothing lack the next letter
 *      (a one-letter look-ahead), when no path from it to a final state reads every letter still to
 *      come (its "future", as a set of letters), or when none of its paths to a final state can end
 *      with the word's last letter (both per state, computed on the first word, for walkers made
 *      with future=True: the guesser, where a suffix chain may begin at any letter and the two
 *      save 40 % of the pairs; on a lexicon analyzer they save less than they cost at start);
 *   2. backward: a pair is useful when a final state at the last position can be reached from it;
 *   3. depth first from the start, along useful edges only, writing the side and output tapes of each
 *      accepting path.
 *
 * Anything out of the ordinary returns None, and the caller walks the word in Python, which has its
 * own guards: more than `max_paths` accepting paths (the Python walker prunes them by weight), a chain
 * of more than MAX_FREE_DEPTH arcs that read nothing in a row (a cycle of such arcs on a useful path),
 * a word longer than MAX_WORD letters, or more pairs, edges or search steps than the bounds below.
 * Nothing is remembered between words except scratch buffers, so memory stays flat over a corpus.
 */
#define PY_SSIZE_T_CLEAN
#include <Python.h>
#include <math.h>
#include <stdint.h>
#include <stdlib.h>
#include <string.h>

#define MAX_FREE_DEPTH 64       /* the Python walker's MAX_CLOSURE_DEPTH */
#define MAX_WORD 256
#define MAX_PAIRS (1 << 20)
#define MAX_EDGES (1 << 22)
#define MAX_STEPS 4000000L
#define LETTER_TABLE 0x3000     /* code points with a bit of their own (others share SHARED_BIT) */
#define SHARED_BIT 60
#define NO_BIT 0xFF
#define END_BIT (1ULL << 61)
#define ACTIVE_BIT (1ULL << 62)
#define DONE_BIT (1ULL << 63)
#define ANY_MASK (((1ULL << (SHARED_BIT + 1)) - 1) | END_BIT)
#define LIVE_BIT (1ULL << 63)
#define MAX_FUTURE_SWEEPS 64    /* past this the filter is switched off (it only ever saves time) */

typedef struct {
    uint32_t from, to, arc;
} Edge;

typedef struct {
    uint32_t pair;     /* (position, state) pair of this frame */
    uint32_t cursor;   /* next edge of the pair to try */
    uint32_t letters;  /* 1 once the cursor is in the pair's letter edges */
    uint32_t side_len, out_len;
    uint32_t free_depth;
    double weight;
} Frame;

typedef struct PathRec {
    size_t side, out; /* offsets in the pool */
    uint32_t side_len, out_len;
    double weight;
} PathRec;

typedef struct {
    PyObject_HEAD
    Py_buffer views[6];
    int nviews;
    const uint32_t *first, *ilabel, *olabel, *next;
    const double *weight, *final;
    Py_ssize_t nstates, narcs;
    long long start;
    uint32_t skip[8];
    int nskip;
    int sorted;
    /* per state, what can follow it by arcs that read nothing: the letters it can read then (one bit
     * per letter of the table's alphabet, letters past the first 60 share the last bit) and whether
     * it can end there; computed on first use (see mask_of) */
    uint64_t *mask;
    uint64_t *arc_mask; /* per arc, the mask of its target (read beside the arc: fewer cache misses) */
    /* per state, the letters read on some path from it to a final state (LIVE_BIT when there is such a
     * path), computed on first use (see compute_future); per position of the last word, the letters from
     * there to its end: a pair whose state cannot read them all has no way to the end */
    uint64_t *future;   /* NULL unless the walker was made with future=True */
    int use_future;
    uint64_t *last_letter; /* per state, the letters that can be the last one read on a way to a final state */
    uint64_t rest[MAX_WORD + 2];
    uint64_t final_need[MAX_WORD + 2]; /* per position: the word's last letter, or the end at the end */
    unsigned char letter_bit[LETTER_TABLE];
    /* scratch, grown as needed and kept between calls */
    /* per pair: its state and position, and its edges: those that read nothing are
     * edges[free_begin, free_end), those that read the next letter edges[letter_begin, letter_end) */
    uint32_t *pair_state, *pair_pos, *free_begin, *free_end, *letter_begin, *letter_end;
    unsigned char *useful;
    size_t pairs_cap;
    Edge *edges;
    size_t edges_cap;
    uint64_t *hkeys;
    uint32_t *hvals;
    uint32_t *hgen;
    size_t hcap;
    uint32_t gen;
    Frame *frames;
    size_t frames_cap;
    Py_UCS4 *side, *out;
    size_t tape_cap;
    /* the paths of the last word: their tapes one after another in `pool` */
    struct PathRec *found;
    size_t found_cap;
    Py_UCS4 *pool;
    size_t pool_cap;
    /* the last word's figures: (position, state) pairs and edges of the forward pass */
    Py_ssize_t last_pairs, last_edges, last_looked;
    int back_edges; /* some edge of the last word leads to a pair added no later than its source */
    /* set while a word is walked: building the result objects can run a finalizer that lets another
     * thread in, and a second word must not reuse the scratch buffers of the first (it gets None) */
    int busy;
} Walker;

static int grow(void **p, size_t *cap, size_t need, size_t item) {
    if (need <= *cap) return 0;
    size_t n = *cap ? *cap : 256;
    while (n < need) n *= 2;
    void *q = realloc(*p, n * item);
    if (!q) { PyErr_NoMemory(); return -1; }
    *p = q;
    *cap = n;
    return 0;
}

static int grow_pairs(Walker *w, size_t need) {
    if (need <= w->pairs_cap) return 0;
    size_t n = w->pairs_cap ? w->pairs_cap : 256;
    while (n < need) n *= 2;
    uint32_t *a = realloc(w->pair_state, n * sizeof *a); if (!a) goto fail; w->pair_state = a;
    a = realloc(w->pair_pos, n * sizeof *a); if (!a) goto fail; w->pair_pos = a;
    a = realloc(w->free_begin, n * sizeof *a); if (!a) goto fail; w->free_begin = a;
    a = realloc(w->free_end, n * sizeof *a); if (!a) goto fail; w->free_end = a;
    a = realloc(w->letter_begin, n * sizeof *a); if (!a) goto fail; w->letter_begin = a;
    a = realloc(w->letter_end, n * sizeof *a); if (!a) goto fail; w->letter_end = a;
    unsigned char *u = realloc(w->useful, n); if (!u) goto fail; w->useful = u;
    w->pairs_cap = n;
    return 0;
fail:
    PyErr_NoMemory();
    return -1;
}

/* The hash of (position, state) pairs to their index: open addressing; a slot belongs to this word
 * when its generation is the current one, so nothing is cleared between words. */
static int hash_init(Walker *w, size_t pairs) {
    size_t need = 64;
    while (need < pairs * 2) need *= 2;
    if (need > w->hcap) {
        free(w->hkeys); free(w->hvals); free(w->hgen);
        w->hkeys = malloc(need * sizeof *w->hkeys);
        w->hvals = malloc(need * sizeof *w->hvals);
        w->hgen = calloc(need, sizeof *w->hgen);
        if (!w->hkeys || !w->hvals || !w->hgen) {
            free(w->hkeys); free(w->hvals); free(w->hgen);
            w->hkeys = NULL; w->hvals = NULL; w->hgen = NULL; w->hcap = 0;
            PyErr_NoMemory();
            return -1;
        }
        w->hcap = need;
        w->gen = 0;
    }
    w->gen++;
    if (w->gen == 0) {  /* wrapped: clear once */
        memset(w->hgen, 0, w->hcap * sizeof *w->hgen);
        w->gen = 1;
    }
    return 0;
}

static inline size_t hash_slot(uint64_t key, size_t mask) {
    key ^= key >> 33;
    key *= 0xff51afd7ed558ccdULL;
    key ^= key >> 33;
    return (size_t)key & mask;
}

/* Index of pair (pos, state), added when new; -1 on error or when the bounds are passed (*over set). */
static long long pair_of(Walker *w, uint32_t pos, uint32_t state, size_t *npairs, int *over) {
    uint64_t key = ((uint64_t)pos << 32) | state;
    size_t mask = w->hcap - 1;
    size_t i = hash_slot(key, mask);
    while (w->hgen[i] == w->gen) {
        if (w->hkeys[i] == key) return w->hvals[i];
        i = (i + 1) & mask;
    }
    if (*npairs >= MAX_PAIRS) { *over = 1; return -1; }
    if (*npairs * 2 >= w->hcap) {
        /* rehash into a table twice the size */
        size_t old_cap = w->hcap;
        uint64_t *ok = w->hkeys; uint32_t *ov = w->hvals; uint32_t *og = w->hgen;
        uint32_t g = w->gen;
        size_t ncap = old_cap * 2;
        uint64_t *nk = malloc(ncap * sizeof *nk);
        uint32_t *nv = malloc(ncap * sizeof *nv);
        uint32_t *ng = calloc(ncap, sizeof *ng);
        if (!nk || !nv || !ng) { free(nk); free(nv); free(ng); PyErr_NoMemory(); return -1; }
        for (size_t j = 0; j < old_cap; j++) {
            if (og[j] != g) continue;
            size_t s = hash_slot(ok[j], ncap - 1);
            while (ng[s] == 1) s = (s + 1) & (ncap - 1);
            nk[s] = ok[j]; nv[s] = ov[j]; ng[s] = 1;
        }
        free(ok); free(ov); free(og);
        w->hkeys = nk; w->hvals = nv; w->hgen = ng; w->hcap = ncap; w->gen = 1;
        mask = ncap - 1;
        i = hash_slot(key, mask);
        while (w->hgen[i] == w->gen) i = (i + 1) & mask;
    }
    if (grow_pairs(w, *npairs + 1) < 0) return -1;
    size_t p = (*npairs)++;
    w->pair_state[p] = state;
    w->pair_pos[p] = pos;
    w->free_begin[p] = w->free_end[p] = w->letter_begin[p] = w->letter_end[p] = 0;
    w->useful[p] = 0;
    w->hgen[i] = w->gen;
    w->hkeys[i] = key;
    w->hvals[i] = (uint32_t)p;
    return (long long)p;
}

/* First arc of `state` whose input label is at least `label` (arcs sorted by input label). */
static inline uint32_t lower_bound(const Walker *w, uint32_t state, uint32_t label) {
    uint32_t lo = w->first[state], hi = w->first[state + 1];
    while (lo < hi) {
        uint32_t mid = lo + (hi - lo) / 2;
        if (w->ilabel[mid] < label) lo = mid + 1; else hi = mid;
    }
    return lo;
}

static inline int is_skip(const Walker *w, uint32_t label) {
    for (int k = 0; k < w->nskip; k++)
        if (w->skip[k] == label) return 1;
    return 0;
}

/* The bit of a letter (0 when no arc of the table reads it: nothing can follow then). */
static inline uint64_t letter_mask(const Walker *w, uint32_t letter) {
    if (letter >= LETTER_TABLE) return 1ULL << SHARED_BIT;
    unsigned char bit = w->letter_bit[letter];
    return bit == NO_BIT ? 0 : 1ULL << bit;
}

/* What can follow `state` through arcs that read nothing (see Walker.mask), memoized. A cycle of such
 * arcs, or a chain longer than MAX_FREE_DEPTH, gives ANY_MASK: the filter then lets everything through
 * (it only ever skips pairs with no way on, so a coarse mask costs time, never a path). */
static uint64_t mask_of(Walker *w, uint32_t state, int depth) {
    uint64_t m = w->mask[state];
    if (m & DONE_BIT) return m;
    if ((m & ACTIVE_BIT) || depth > MAX_FREE_DEPTH) return ANY_MASK;
    w->mask[state] = ACTIVE_BIT;
    m = isinf(w->final[state]) ? 0 : END_BIT;
    for (uint32_t a = w->first[state]; a < w->first[state + 1]; a++) {
        uint32_t il = w->ilabel[a];
        if (il == 0 || is_skip(w, il)) m |= mask_of(w, w->next[a], depth + 1);
        else m |= letter_mask(w, il);
    }
    m = (m & ANY_MASK) | DONE_BIT;
    w->mask[state] = m;
    return m;
}

/* Each state's future (see Walker.future): the least fixed point of future(s) = LIVE_BIT if s is final,
 * | the letter and future of every arc to a live state, by sweeps over the table until nothing changes
 * (few: the tables come from optimized transducers, their states mostly in order). A state that
 * cannot reach a final state gets 0. When the sweeps do not settle, every state gets every bit. */
static int compute_future(Walker *w) {
    uint64_t *f = calloc((size_t)w->nstates + 1, sizeof *f);
    if (!f) { PyErr_NoMemory(); return -1; }
    int changed = 1, sweeps = 0;
    while (changed && sweeps++ < MAX_FUTURE_SWEEPS) {
        changed = 0;
        for (Py_ssize_t s = w->nstates; s-- > 0;) {
            uint64_t m = f[s] | (isinf(w->final[s]) ? 0 : LIVE_BIT);
            for (uint32_t a = w->first[s]; a < w->first[s + 1]; a++) {
                uint64_t t = f[w->next[a]];
                if (!(t & LIVE_BIT)) continue;
                uint32_t il = w->ilabel[a];
                m |= t | ((il == 0 || is_skip(w, il)) ? 0 : letter_mask(w, il));
            }
            if (m != f[s]) { f[s] = m; changed = 1; }
        }
    }
    if (changed)
        for (Py_ssize_t s = 0; s < w->nstates; s++) f[s] = ~0ULL;
    /* the last letter: end(s) when a final state is reached from s by arcs that read nothing; then
     * last(s) = the letter of every arc to a state t with end(t), | last(t) of every arc to a live t */
    uint64_t *l = calloc((size_t)w->nstates + 1, sizeof *l);
    if (!l) { free(f); PyErr_NoMemory(); return -1; }
    changed = 1; sweeps = 0;
    while (changed && sweeps++ < MAX_FUTURE_SWEEPS) {
        changed = 0;
        for (Py_ssize_t s = w->nstates; s-- > 0;) {
            uint64_t m = l[s] | (isinf(w->final[s]) ? 0 : END_BIT);
            for (uint32_t a = w->first[s]; a < w->first[s + 1]; a++) {
                uint32_t t = w->next[a], il = w->ilabel[a];
                if (!(f[t] & LIVE_BIT)) continue;
                if (il == 0 || is_skip(w, il)) m |= l[t];
                else m |= (l[t] & ~END_BIT) | ((l[t] & END_BIT) ? letter_mask(w, il) : 0);
            }
            if (m != l[s]) { l[s] = m; changed = 1; }
        }
    }
    if (changed)
        for (Py_ssize_t s = 0; s < w->nstates; s++) l[s] = ~0ULL;
    w->future = f;
    w->last_letter = l;
    return 0;
}

static int add_edge(Walker *w, size_t *nedges, uint32_t from, uint32_t to, uint32_t arc, int *over) {
    if (*nedges >= MAX_EDGES) { *over = 1; return -1; }
    if (grow((void **)&w->edges, &w->edges_cap, *nedges + 1, sizeof(Edge)) < 0) return -1;
    w->edges[*nedges].from = from;
    w->edges[*nedges].to = to;
    w->edges[*nedges].arc = arc;
    (*nedges)++;
    return 0;
}

/* Follow one arc from pair `from` to its target at position `pos` (the edge is recorded), unless what
 * can follow the target (mask_of) has nothing of `need`: the letter at `pos`, or the end. */
static inline int take(Walker *w, uint32_t from, uint32_t pos, uint32_t arc, uint64_t need, size_t *npairs, size_t *nedges,
                       int *over) {
    w->last_looked++;
    uint64_t m = w->arc_mask[arc];
    if (!m) m = w->arc_mask[arc] = mask_of(w, w->next[arc], 0);
    if (!(m & need)) return 0; /* no way on from there */
    if (w->future) {
        uint64_t rest = w->rest[pos] | LIVE_BIT;
        uint32_t t = w->next[arc];
        if ((w->future[t] & rest) != rest) return 0;              /* nor to the end */
        if (!(w->last_letter[t] & w->final_need[pos])) return 0; /* nor ending with the word's last letter */
    }
    long long to = pair_of(w, pos, w->next[arc], npairs, over);
    if (to < 0) return -1;
    if ((uint32_t)to <= from) w->back_edges = 1;
    return add_edge(w, nedges, from, (uint32_t)to, arc, over);
}

/* Pass 1. Returns the number of edges (the pairs in *npairs_out), 0 with no pairs when the word has
 * no path, -1 on a Python error, -2 when a bound is passed. Edges are kept in the order they are
 * taken, so that a pair's edges are two runs (see Walker.free_begin). */
static long long forward(Walker *w, const Py_UCS4 *word, Py_ssize_t n, size_t *npairs_out) {
    size_t npairs = 0, nedges = 0;
    int over = 0;
    if (!w->mask) {
        w->mask = calloc((size_t)w->nstates + 1, sizeof *w->mask);
        w->arc_mask = calloc((size_t)w->narcs + 1, sizeof *w->arc_mask);
        if (!w->mask || !w->arc_mask) {
            free(w->mask); free(w->arc_mask); w->mask = NULL; w->arc_mask = NULL;
            PyErr_NoMemory();
            return -1;
        }
    }
    if (w->use_future && !w->future && compute_future(w) < 0) return -1;
    w->rest[n] = 0;
    for (Py_ssize_t k = n; k-- > 0;) w->rest[k] = w->rest[k + 1] | letter_mask(w, (uint32_t)word[k]);
    uint64_t last = n ? letter_mask(w, (uint32_t)word[n - 1]) : END_BIT;
    for (Py_ssize_t k = 0; k < n; k++) w->final_need[k] = last ? last : ~0ULL;
    w->final_need[n] = END_BIT;
    if (hash_init(w, 1024) < 0) return -1;
    w->last_looked = 0;
    w->back_edges = 0;
    uint64_t need = n ? letter_mask(w, (uint32_t)word[0]) : END_BIT;
    if (!(mask_of(w, (uint32_t)w->start, 0) & need)) return 0;
    if (w->future && (w->future[w->start] & (w->rest[0] | LIVE_BIT)) != (w->rest[0] | LIVE_BIT)) return 0;
    if (pair_of(w, 0, (uint32_t)w->start, &npairs, &over) < 0) return over ? -2 : -1;
    size_t begin = 0;
    for (Py_ssize_t pos = 0; pos <= n; pos++) {
        need = pos < n ? letter_mask(w, (uint32_t)word[pos]) : END_BIT;
        /* arcs that read nothing, until the position's set is closed under them */
        for (size_t i = begin; i < npairs; i++) {
            uint32_t s = w->pair_state[i];
            uint32_t a = w->first[s], end = w->first[s + 1];
            w->free_begin[i] = (uint32_t)nedges;
            if (w->sorted) {
                for (; a < end && w->ilabel[a] == 0; a++)
                    if (take(w, (uint32_t)i, (uint32_t)pos, a, need, &npairs, &nedges, &over) < 0) return over ? -2 : -1;
                for (int k = 0; k < w->nskip; k++)
                    for (a = lower_bound(w, s, w->skip[k]); a < end && w->ilabel[a] == w->skip[k]; a++)
                        if (take(w, (uint32_t)i, (uint32_t)pos, a, need, &npairs, &nedges, &over) < 0) return over ? -2 : -1;
            } else {
                for (; a < end; a++)
                    if (w->ilabel[a] == 0 || is_skip(w, w->ilabel[a]))
                        if (take(w, (uint32_t)i, (uint32_t)pos, a, need, &npairs, &nedges, &over) < 0) return over ? -2 : -1;
            }
            w->free_end[i] = (uint32_t)nedges;
        }
        size_t end_pos = npairs;
        if (pos == n) break;
        /* arcs that read the letter: into the next position's set */
        uint32_t c = (uint32_t)word[pos];
        need = pos + 1 < n ? letter_mask(w, (uint32_t)word[pos + 1]) : END_BIT;
        if (c != 0 && !is_skip(w, c)) {
            for (size_t i = begin; i < end_pos; i++) {
                uint32_t s = w->pair_state[i];
                uint32_t a, end = w->first[s + 1];
                w->letter_begin[i] = (uint32_t)nedges;
                if (w->sorted) {
                    for (a = lower_bound(w, s, c); a < end && w->ilabel[a] == c; a++)
                        if (take(w, (uint32_t)i, (uint32_t)(pos + 1), a, need, &npairs, &nedges, &over) < 0) return over ? -2 : -1;
                } else {
                    for (a = w->first[s]; a < end; a++)
                        if (w->ilabel[a] == c)
                            if (take(w, (uint32_t)i, (uint32_t)(pos + 1), a, need, &npairs, &nedges, &over) < 0) return over ? -2 : -1;
                }
                w->letter_end[i] = (uint32_t)nedges;
            }
        }
        if (npairs == end_pos) return 0; /* no state reads this letter */
        begin = end_pos;
    }
    *npairs_out = npairs;
    w->last_pairs = (Py_ssize_t)npairs;
    w->last_edges = (Py_ssize_t)nedges;
    return (long long)nedges;
}

/* Pass 2: mark the pairs from which a final state at position n is reached. Pairs were added in
 * order of position, and within a position every pair that reaches another by arcs that read nothing
 * either precedes it or lies on a cycle; sweeping backwards until nothing changes covers both. */
static int mark_useful(Walker *w, size_t npairs, Py_ssize_t n) {
    int any = 0;
    for (size_t p = 0; p < npairs; p++) {
        w->useful[p] = 0;
        if (w->pair_pos[p] == (uint32_t)n && !isinf(w->final[w->pair_state[p]])) { w->useful[p] = 1; any = 1; }
    }
    if (!any) return 0;
    /* without edges back to earlier pairs, one sweep from the last pair to the first is exact */
    int changed = 1;
    for (int sweep = 0; changed && (sweep == 0 || w->back_edges); sweep++) {
        changed = 0;
        for (size_t q = npairs; q-- > 0;) {
            if (w->useful[q]) continue;
            int on = 0;
            for (uint32_t e = w->free_begin[q]; e < w->free_end[q] && !on; e++) on = w->useful[w->edges[e].to];
            for (uint32_t e = w->letter_begin[q]; e < w->letter_end[q] && !on; e++) on = w->useful[w->edges[e].to];
            if (on) { w->useful[q] = 1; changed = 1; }
        }
    }
    return w->useful[0] ? 1 : 0;
}

/* Keep one accepting path: its tapes go to the pool. */
static int keep_path(Walker *w, size_t *count, size_t *used, uint32_t side_len, uint32_t out_len, double weight) {
    if (grow((void **)&w->found, &w->found_cap, *count + 1, sizeof(PathRec)) < 0) return -1;
    if (grow((void **)&w->pool, &w->pool_cap, *used + side_len + out_len + 1, sizeof(Py_UCS4)) < 0) return -1;
    PathRec *r = &w->found[(*count)++];
    r->side = *used;
    memcpy(w->pool + *used, w->side, side_len * sizeof(Py_UCS4));
    *used += side_len;
    r->out = *used;
    memcpy(w->pool + *used, w->out, out_len * sizeof(Py_UCS4));
    *used += out_len;
    r->side_len = side_len;
    r->out_len = out_len;
    r->weight = weight;
    return 0;
}

static const Py_UCS4 *sort_pool; /* qsort has no context argument; the GIL is held throughout */

static int compare_tape(const Py_UCS4 *a, uint32_t na, const Py_UCS4 *b, uint32_t nb) {
    uint32_t n = na < nb ? na : nb;
    for (uint32_t i = 0; i < n; i++)
        if (a[i] != b[i]) return a[i] < b[i] ? -1 : 1;
    return na == nb ? 0 : (na < nb ? -1 : 1);
}

/* By side tape, output, weight: a (side, output) pair's copies are then together, lowest first. */
static int by_tapes(const void *x, const void *y) {
    const PathRec *a = x, *b = y;
    int c = compare_tape(sort_pool + a->side, a->side_len, sort_pool + b->side, b->side_len);
    if (!c) c = compare_tape(sort_pool + a->out, a->out_len, sort_pool + b->out, b->out_len);
    if (!c) c = a->weight < b->weight ? -1 : (a->weight > b->weight ? 1 : 0);
    return c;
}

/* By weight, output, side tape: the order the walk returns (as walk._ranked sorts). */
static int by_rank(const void *x, const void *y) {
    const PathRec *a = x, *b = y;
    if (a->weight != b->weight) return a->weight < b->weight ? -1 : 1;
    int c = compare_tape(sort_pool + a->out, a->out_len, sort_pool + b->out, b->out_len);
    if (!c) c = compare_tape(sort_pool + a->side, a->side_len, sort_pool + b->side, b->side_len);
    return c;
}

/* The kept paths, each (side, output) once at its lowest weight, ranked, at most `limit`, as a list
 * of (side, output, weight) tuples. */
static PyObject *ranked(Walker *w, size_t count, long limit) {
    sort_pool = w->pool;
    if (count > 1) {
        qsort(w->found, count, sizeof(PathRec), by_tapes);
        size_t kept = 1;
        for (size_t i = 1; i < count; i++) {
            const PathRec *a = &w->found[kept - 1], *b = &w->found[i];
            if (compare_tape(w->pool + a->side, a->side_len, w->pool + b->side, b->side_len) == 0 &&
                compare_tape(w->pool + a->out, a->out_len, w->pool + b->out, b->out_len) == 0)
                continue;
            w->found[kept++] = *b;
        }
        count = kept;
        qsort(w->found, count, sizeof(PathRec), by_rank);
    }
    if (limit >= 0 && (size_t)limit < count) count = (size_t)limit;
    PyObject *list = PyList_New((Py_ssize_t)count);
    if (!list) return NULL;
    for (size_t i = 0; i < count; i++) {
        const PathRec *r = &w->found[i];
        PyObject *side = PyUnicode_FromKindAndData(PyUnicode_4BYTE_KIND, w->pool + r->side, r->side_len);
        PyObject *out = PyUnicode_FromKindAndData(PyUnicode_4BYTE_KIND, w->pool + r->out, r->out_len);
        PyObject *weight = PyFloat_FromDouble(r->weight);
        PyObject *t = side && out && weight ? PyTuple_New(3) : NULL;
        if (!t) {
            Py_XDECREF(side); Py_XDECREF(out); Py_XDECREF(weight); Py_DECREF(list);
            return NULL;
        }
        PyTuple_SET_ITEM(t, 0, side);
        PyTuple_SET_ITEM(t, 1, out);
        PyTuple_SET_ITEM(t, 2, weight);
        PyList_SET_ITEM(list, (Py_ssize_t)i, t);
    }
    return list;
}

/* The letters of `text` in `buffer` (MAX_WORD + 1 code points); 0 when it is longer, -1 on error. */
static int word_of(PyObject *text, Py_UCS4 *buffer, Py_ssize_t *n) {
    *n = PyUnicode_GetLength(text);
    if (*n < 0) return -1;
    if (*n > MAX_WORD) return 0;
    return PyUnicode_AsUCS4(text, buffer, MAX_WORD + 1, 0) ? 1 : -1;
}

/* Pass 3: every accepting path, depth first along useful edges, ranked (see ranked()). Returns a new
 * list, Py_None (new reference) when a bound is passed, NULL on error. */
static PyObject *search(Walker *w, const Py_UCS4 *word, Py_ssize_t n, long max_paths, long limit) {
    size_t count = 0, used = 0;
    if (grow((void **)&w->frames, &w->frames_cap, 64, sizeof(Frame)) < 0) return NULL;
    size_t tape = (size_t)(n + 1) * (MAX_FREE_DEPTH + 2) + 16;
    if (tape > w->tape_cap) {
        Py_UCS4 *s = realloc(w->side, tape * sizeof *s);
        if (!s) { PyErr_NoMemory(); return NULL; }
        w->side = s;
        Py_UCS4 *o = realloc(w->out, tape * sizeof *o);
        if (!o) { PyErr_NoMemory(); return NULL; }
        w->out = o;
        w->tape_cap = tape;
    }
    size_t depth = 0;
    long steps = 0;
    Frame *f = &w->frames[0];
    f->pair = 0; f->cursor = w->free_begin[0]; f->letters = 0; f->side_len = f->out_len = 0; f->free_depth = 0; f->weight = 0.0;
    depth = 1;
    /* the start pair is final when the word is empty or the first pair is at position n */
    if (w->pair_pos[0] == (uint32_t)n && !isinf(w->final[w->pair_state[0]])) {
        if (keep_path(w, &count, &used, 0, 0, w->final[w->pair_state[0]]) < 0) return NULL;
    }
    while (depth) {
        f = &w->frames[depth - 1];
        uint32_t e = f->cursor;
        uint32_t end = f->letters ? w->letter_end[f->pair] : w->free_end[f->pair];
        while (e < end && !w->useful[w->edges[e].to]) e++;
        if (e >= end) {
            if (!f->letters) { f->letters = 1; f->cursor = w->letter_begin[f->pair]; continue; }
            depth--;
            continue;
        }
        f->cursor = e + 1;
        if (++steps > MAX_STEPS) Py_RETURN_NONE;
        const Edge *edge = &w->edges[e];
        uint32_t arc = edge->arc;
        uint32_t il = w->ilabel[arc], ol = w->olabel[arc];
        int reads = w->pair_pos[edge->to] != w->pair_pos[f->pair];
        uint32_t free_depth = reads ? 0 : f->free_depth + 1;
        if (free_depth > MAX_FREE_DEPTH) Py_RETURN_NONE;
        uint32_t side_len = f->side_len, out_len = f->out_len;
        if (reads) w->side[side_len++] = word[w->pair_pos[f->pair]];
        else if (il != 0) w->side[side_len++] = il;
        if (ol != 0) w->out[out_len++] = ol;
        if (side_len >= w->tape_cap || out_len >= w->tape_cap) Py_RETURN_NONE;
        double weight = f->weight + w->weight[arc];
        uint32_t to = edge->to;
        if (w->pair_pos[to] == (uint32_t)n) {
            double fin = w->final[w->pair_state[to]];
            if (!isinf(fin)) {
                if ((long)count >= max_paths) Py_RETURN_NONE;
                if (keep_path(w, &count, &used, side_len, out_len, weight + fin) < 0) return NULL;
            }
        }
        if (grow((void **)&w->frames, &w->frames_cap, depth + 1, sizeof(Frame)) < 0) return NULL;
        Frame *g = &w->frames[depth++];
        g->pair = to; g->cursor = w->free_begin[to]; g->letters = 0; g->side_len = side_len; g->out_len = out_len;
        g->free_depth = free_depth; g->weight = weight;
    }
    return ranked(w, count, limit);
}

static PyObject *Walker_paths(Walker *w, PyObject *args) {
    PyObject *text;
    long max_paths, limit = -1;
    if (!PyArg_ParseTuple(args, "Ul|l", &text, &max_paths, &limit)) return NULL;
    if (w->start < 0) return PyList_New(0);
    Py_ssize_t n;
    Py_UCS4 word[MAX_WORD + 1];
    int ok = word_of(text, word, &n);
    if (ok < 0) return NULL;
    if (!ok || w->busy) Py_RETURN_NONE;
    w->busy = 1;
    size_t npairs = 0;
    long long nedges = forward(w, word, n, &npairs);
    PyObject *result = NULL;
    if (nedges == -2) { result = Py_None; Py_INCREF(result); }
    else if (nedges == 0 && npairs == 0) result = PyList_New(0);
    else if (nedges >= 0) {
        int live = mark_useful(w, npairs, n);
        result = live ? search(w, word, n, max_paths, limit) : PyList_New(0);
    }
    w->busy = 0;
    return result;
}

static PyObject *Walker_accepts(Walker *w, PyObject *args) {
    PyObject *text;
    if (!PyArg_ParseTuple(args, "U", &text)) return NULL;
    if (w->start < 0) Py_RETURN_FALSE;
    Py_ssize_t n;
    Py_UCS4 word[MAX_WORD + 1];
    int ok = word_of(text, word, &n);
    if (ok < 0) return NULL;
    if (!ok || w->busy) Py_RETURN_NONE;
    size_t npairs = 0;
    long long nedges = forward(w, word, n, &npairs); /* no Python object is made: no other thread runs */
    if (nedges == -1) return NULL;
    if (nedges == -2) Py_RETURN_NONE;
    for (size_t p = 0; p < npairs; p++)
        if (w->pair_pos[p] == (uint32_t)n && !isinf(w->final[w->pair_state[p]])) Py_RETURN_TRUE;
    Py_RETURN_FALSE;
}

static int Walker_init(Walker *w, PyObject *args, PyObject *kwds) {
    static char *names[] = {"first", "ilabel", "olabel", "weight", "next", "final", "start", "skip", "future", NULL};
    PyObject *objs[6];
    long long start;
    PyObject *skip;
    int use_future = 0;
    if (!PyArg_ParseTupleAndKeywords(args, kwds, "OOOOOOLU|p", names, &objs[0], &objs[1], &objs[2], &objs[3], &objs[4],
                                     &objs[5], &start, &skip, &use_future))
        return -1;
    w->use_future = use_future;
    static const char formats[6] = {'I', 'I', 'I', 'd', 'I', 'd'};
    static const Py_ssize_t sizes[6] = {4, 4, 4, 8, 4, 8};
    for (int k = 0; k < 6; k++) {
        if (PyObject_GetBuffer(objs[k], &w->views[k], PyBUF_FORMAT | PyBUF_C_CONTIGUOUS) < 0) return -1;
        w->nviews = k + 1;
        const char *fmt = w->views[k].format ? w->views[k].format : "B";
        if (fmt[0] == '<' || fmt[0] == '=' || fmt[0] == '@') fmt++;
        int ok = w->views[k].itemsize == sizes[k] &&
                 (fmt[0] == formats[k] || (formats[k] == 'I' && (fmt[0] == 'L' && sizes[k] == sizeof(unsigned long))));
        if (!ok) {
            PyErr_Format(PyExc_TypeError, "array %d: expected items of format %c and size %zd", k, formats[k], sizes[k]);
            return -1;
        }
    }
    w->first = w->views[0].buf;
    w->ilabel = w->views[1].buf;
    w->olabel = w->views[2].buf;
    w->weight = w->views[3].buf;
    w->next = w->views[4].buf;
    w->final = w->views[5].buf;
    w->nstates = w->views[5].len / 8;
    w->narcs = w->views[1].len / 4;
    if (w->views[0].len / 4 != w->nstates + 1 || w->views[2].len / 4 != w->narcs || w->views[3].len / 8 != w->narcs ||
        w->views[4].len / 4 != w->narcs || (w->nstates && w->first[w->nstates] != (uint32_t)w->narcs)) {
        PyErr_SetString(PyExc_ValueError, "arc table arrays disagree in size");
        return -1;
    }
    for (Py_ssize_t a = 0; a < w->narcs; a++)
        if (w->next[a] >= (uint32_t)w->nstates) {
            PyErr_SetString(PyExc_ValueError, "arc table has an arc to a state it does not have");
            return -1;
        }
    w->start = (start >= 0 && start < w->nstates) ? start : -1;
    Py_ssize_t nskip = PyUnicode_GetLength(skip);
    if (nskip > 8) { PyErr_SetString(PyExc_ValueError, "at most 8 skip labels"); return -1; }
    w->nskip = (int)nskip;
    for (Py_ssize_t k = 0; k < nskip; k++) w->skip[k] = PyUnicode_READ_CHAR(skip, k);
    memset(w->letter_bit, NO_BIT, sizeof w->letter_bit);
    int bits = 0;
    for (Py_ssize_t a = 0; a < w->narcs; a++) {
        uint32_t il = w->ilabel[a];
        if (il == 0 || il >= LETTER_TABLE || is_skip(w, il) || w->letter_bit[il] != NO_BIT) continue;
        w->letter_bit[il] = (unsigned char)(bits < SHARED_BIT ? bits++ : SHARED_BIT);
    }
    w->sorted = 1;
    for (Py_ssize_t s = 0; s < w->nstates && w->sorted; s++)
        for (uint32_t a = w->first[s] + 1; a < w->first[s + 1]; a++)
            if (w->ilabel[a - 1] > w->ilabel[a]) { w->sorted = 0; break; }
    return 0;
}

static void Walker_dealloc(Walker *w) {
    for (int k = 0; k < w->nviews; k++) PyBuffer_Release(&w->views[k]);
    free(w->mask); free(w->future); free(w->last_letter);
    free(w->pair_state); free(w->pair_pos); free(w->free_begin); free(w->free_end);
    free(w->letter_begin); free(w->letter_end); free(w->arc_mask); free(w->useful);
    free(w->edges); free(w->hkeys); free(w->hvals); free(w->hgen); free(w->frames); free(w->side); free(w->out);
    Py_TYPE(w)->tp_free((PyObject *)w);
}

static PyObject *Walker_sorted(Walker *w, void *closure) {
    (void)closure;
    return PyBool_FromLong(w->sorted);
}

static PyMethodDef Walker_methods[] = {
    {"paths", (PyCFunction)Walker_paths, METH_VARARGS,
     "paths(word, max_paths, limit=-1) -> list of (side tape, output, weight) of the accepting paths, each\n"
     "(side tape, output) once at its lowest weight, by weight, output, side tape, at most limit (-1: all);\n"
     "None when the word passes a bound (more than max_paths paths, a long chain of arcs that read nothing)."},
    {"accepts", (PyCFunction)Walker_accepts, METH_VARARGS,
     "accepts(word) -> True when some path reads the word; None when a bound is passed."},
    {NULL, NULL, 0, NULL},
};

static PyObject *Walker_last(Walker *w, void *closure) {
    (void)closure;
    return Py_BuildValue("(nnn)", w->last_pairs, w->last_edges, w->last_looked);
}

static PyGetSetDef Walker_getset[] = {
    {"last", (getter)Walker_last, NULL, "(pairs, edges, arcs looked at) of the last word's forward pass (a word with a path).", NULL},
    {"sorted", (getter)Walker_sorted, NULL, "True when every state's arcs are sorted by input label.", NULL},
    {NULL, NULL, NULL, NULL, NULL},
};

static PyTypeObject WalkerType = {
    PyVarObject_HEAD_INIT(NULL, 0)
    .tp_name = "morphfst.runtime._cwalk.Walker",
    .tp_basicsize = sizeof(Walker),
    .tp_flags = Py_TPFLAGS_DEFAULT,
    .tp_doc = "The paths of words through one packed arc table (see the module's docstring).",
    .tp_new = PyType_GenericNew,
    .tp_init = (initproc)Walker_init,
    .tp_dealloc = (destructor)Walker_dealloc,
    .tp_methods = Walker_methods,
    .tp_getset = Walker_getset,
};

static struct PyModuleDef module = {
    PyModuleDef_HEAD_INIT, "_cwalk", "The arc walk of morphfst.runtime.walk, in C.", -1, NULL, NULL, NULL, NULL, NULL,
};

PyMODINIT_FUNC PyInit__cwalk(void) {
    if (PyType_Ready(&WalkerType) < 0) return NULL;
    PyObject *m = PyModule_Create(&module);
    if (!m) return NULL;
    Py_INCREF(&WalkerType);
    if (PyModule_AddObject(m, "Walker", (PyObject *)&WalkerType) < 0) {
        Py_DECREF(&WalkerType);
        Py_DECREF(m);
        return NULL;
    }
    return m;
}
