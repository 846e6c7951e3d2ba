/*
 * Start-up of the native command: at every start the NativeAOT runtime writes its data structures
 * (method tables, generic dictionaries; about 4.6 MB for this command) into the zero-filled tail of
 * the executable's writable segment (the `.hydrated` section), one page fault per 4 KB page. On a
 * virtual machine a fault can cost 20 µs, so that writing was most of a short command's time.
 * Before the runtime starts, this asks for transparent huge pages on that range (2 MB pages where
 * the range holds an aligned 2 MB, in THP's "madvise" mode, the usual default) and then populates
 * it in one call (MADV_POPULATE_WRITE, Linux 5.14+), so the runtime writes into pages already
 * there instead of faulting page by page. A kernel that knows neither refuses them and the start
 * is as before. Runs as an ELF constructor, before main. RESULTS.md ("Huge pages for the
 * runtime's data") has the figures.
 */
#define _GNU_SOURCE
#include <link.h>
#include <stdint.h>
#include <sys/mman.h>
#include <unistd.h>

#ifndef MADV_POPULATE_WRITE
#define MADV_POPULATE_WRITE 23
#endif

static int advise(struct dl_phdr_info *info, size_t size, void *data)
{
    (void)size;
    (void)data;
    uintptr_t page = (uintptr_t)sysconf(_SC_PAGESIZE);
    for (int i = 0; i < info->dlpi_phnum; i++)
    {
        const ElfW(Phdr) *p = &info->dlpi_phdr[i];
        /* The writable segment's part beyond its file contents: .bss and the runtime's data. */
        if (p->p_type != PT_LOAD || !(p->p_flags & PF_W) || p->p_memsz <= p->p_filesz) continue;
        uintptr_t start = (info->dlpi_addr + p->p_vaddr + p->p_filesz + page - 1) & ~(page - 1);
        uintptr_t end = (info->dlpi_addr + p->p_vaddr + p->p_memsz) & ~(page - 1);
        if (end <= start) continue;
        madvise((void *)start, end - start, MADV_HUGEPAGE);
        madvise((void *)start, end - start, MADV_POPULATE_WRITE);
    }
    return 1; /* the first object is the executable itself */
}

__attribute__((constructor)) static void wn_hugepages(void) { dl_iterate_phdr(advise, 0); }
