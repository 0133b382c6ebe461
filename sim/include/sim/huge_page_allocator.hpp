#pragma once
// An allocator for the engine's large per-particle arrays: blocks of 4 MiB and more are
// aligned to 2 MiB and offered to the kernel for transparent huge pages (Linux madvise
// MADV_HUGEPAGE; a hint, harmless where refused or unsupported). With N = 1e6 particles the
// neighbour loads of the pair loops touch tens of megabytes at random: with 4 KiB pages
// most of them also miss the TLB. Smaller blocks come from operator new as usual.
#include <cstddef>
#include <cstdlib>
#include <new>
#include <vector>

#if defined(__linux__)
#include <sys/mman.h>
#endif

namespace brownfloc::sim {

template <class T>
struct HugePageAllocator {
    using value_type = T;
    static constexpr std::size_t huge_page_bytes = std::size_t{2} << 20;
    static constexpr std::size_t threshold_bytes = std::size_t{4} << 20;

    HugePageAllocator() = default;
    template <class U>
    constexpr HugePageAllocator(const HugePageAllocator<U>&) noexcept {}

    [[nodiscard]] T* allocate(std::size_t n) {
        if (n > static_cast<std::size_t>(-1) / sizeof(T)) throw std::bad_array_new_length();
        const std::size_t bytes = n * sizeof(T);
        if (bytes < threshold_bytes) return static_cast<T*>(::operator new(bytes));
        const std::size_t rounded = (bytes + huge_page_bytes - 1) / huge_page_bytes * huge_page_bytes;
        void* p = std::aligned_alloc(huge_page_bytes, rounded);
        if (!p) throw std::bad_alloc();
#if defined(__linux__) && defined(MADV_HUGEPAGE)
        (void)madvise(p, rounded, MADV_HUGEPAGE);
#endif
        return static_cast<T*>(p);
    }
    void deallocate(T* p, std::size_t n) noexcept {
        if (n * sizeof(T) < threshold_bytes) ::operator delete(p);
        else std::free(p);
    }
    template <class U>
    bool operator==(const HugePageAllocator<U>&) const noexcept { return true; }
};

// A std::vector whose large buffers are offered huge pages.
template <class T>
using ParticleArray = std::vector<T, HugePageAllocator<T>>;

}  // namespace brownfloc::sim
